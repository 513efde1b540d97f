import { and, asc, eq, ne } from 'drizzle-orm'
import type { Executor } from '@db/client'
import { vehicles, yardSpaces } from '@db/schema'
import { spaceLabel, type Space } from '@shared/schemas/spaces'
import { spaceFit } from '@shared/domain/vehicle'
import { badRequest, conflict, fieldIssue, unprocessable } from '../errors'

export async function spacesOfYard(db: Executor, yardId: string): Promise<Space[]> {
  const rows = await db
    .select({ space: yardSpaces, vehicleId: vehicles.id, stockNumber: vehicles.stockNumber })
    .from(yardSpaces)
    .leftJoin(vehicles, eq(vehicles.spaceId, yardSpaces.id))
    .where(eq(yardSpaces.yardId, yardId))
    .orderBy(asc(yardSpaces.row), asc(yardSpaces.number))
  return rows.map((r) => ({
    id: r.space.id,
    row: r.space.row,
    number: r.space.number,
    size: r.space.size,
    retired: r.space.retiredAt !== null,
    label: spaceLabel(r.space),
    occupant: r.vehicleId ? { id: r.vehicleId, stockNumber: r.stockNumber! } : null,
  }))
}

/**
 * A space of this yard that no other vehicle holds; the label for messages and history. The unique
 * index on vehicles.space_id still decides a race between two dispatchers (see spaceTaken).
 */
export async function freeSpace(db: Executor, yardId: string, spaceId: string, path: string, forVehicleId?: string, vehicleClass?: string) {
  const [space] = await db.select().from(yardSpaces).where(and(eq(yardSpaces.id, spaceId), eq(yardSpaces.yardId, yardId)))
  if (!space) throw badRequest('That space is not in this yard.', [fieldIssue(path, 'spaces.notInYard', 'That space is not in this yard.')])
  const label = spaceLabel(space)
  if (space.retiredAt) {
    const message = `Space ${label} is retired. Choose another space.`
    throw conflict(message, { issues: [fieldIssue(path, 'spaces.retired', message, { label })] })
  }
  const fit = vehicleClass === undefined ? null : spaceFit(vehicleClass, space.size)
  if (fit && !fit.fits) {
    const message = `Space ${label}: ${fit.reason}`
    throw unprocessable(message, { issues: [fieldIssue(path, 'spaces.tooSmall', message, { label, reason: fit.reason, fitCode: fit.code, ...fit.params })], needs: fit.needs })
  }
  const holder = db.select({ stockNumber: vehicles.stockNumber }).from(vehicles)
  const [taken] = await (forVehicleId
    ? holder.where(and(eq(vehicles.spaceId, spaceId), ne(vehicles.id, forVehicleId)))
    : holder.where(eq(vehicles.spaceId, spaceId)))
  if (taken) throw spaceTaken(label, path, taken.stockNumber)
  return label
}

export function spaceTaken(label: string | null, path: string, stockNumber?: string) {
  const message = `${label ? `Space ${label}` : 'That space'} already holds ${stockNumber ?? 'another vehicle'}. Choose another space.`
  // The database's own refusal (a race) may know neither the label nor the vehicle: four ways to say it.
  const code = label ? (stockNumber ? 'spaces.takenBy' : 'spaces.taken') : stockNumber ? 'spaces.thatTakenBy' : 'spaces.thatTaken'
  return conflict(message, { issues: [fieldIssue(path, code, message, { ...(label ? { label } : {}), ...(stockNumber ? { stock: stockNumber } : {}) })] })
}

/** True when the error (or one it wraps) is the database refusing a second vehicle in one space. */
export function isSpaceConflict(err: unknown): boolean {
  let e: unknown = err
  while (e && typeof e === 'object') {
    const { code, constraint, message } = e as { code?: string; constraint?: string; message?: string }
    if (code === '23505' && `${constraint ?? ''} ${message ?? ''}`.includes('vehicles_space_occupied')) return true
    e = (e as { cause?: unknown }).cause
  }
  return false
}
