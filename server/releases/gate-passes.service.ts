import { and, eq, isNull } from 'drizzle-orm'
import type { Executor } from '@db/client'
import { gatePasses, vehicles, yards } from '@db/schema'
import { dispositionFor, type GateRecorded, type GateVehicle } from '@shared/schemas/releases'
import type { User } from '@shared/schemas/users'
import { cardOf, judgeMove, makeMove } from '../board/index'
import { AppError, conflict, reasonParams, unprocessable, said } from '../errors'
import { changeVehicle, spaceOf, vehicleForUser, type VehicleChanges } from '../vehicles/index'
import { yardOfStaff } from '../yards/index'
import { gateHash, newGateCode, newGateToken, readPass } from './gate-keys'
import { photoOf, releaseOf } from './releases.queries'

/** How long a pass opens the gate: the rest of a working day and the next one (trade practice, not a rule). */
export const GATE_PASS_HOURS = 24

export interface IssuedPass {
  id: string
  token: string
  code: string
  expiresAt: Date
}

/**
 * A gate pass for the vehicle, once every guard of the closing move passes for the way its claimant
 * takes it. The token and code are answered once, here, and stored only as hashes; a newer pass
 * withdraws any older one still open. The history names the pass by id, never its token.
 */
export async function issueGatePass(changes: VehicleChanges, actor: User, vehicleId: string, now = new Date()): Promise<IssuedPass> {
  const token = newGateToken()
  const code = newGateCode()
  const expiresAt = new Date(now.getTime() + GATE_PASS_HOURS * 3_600_000)
  const { result } = await changeVehicle(changes, actor, vehicleId, async (w) => {
    if (w.vehicle.state !== 'release') throw conflict(`Move ${w.vehicle.stockNumber} to Release first, then issue the gate pass.`, said('releaseFirst', { stock: w.vehicle.stockNumber }))
    const release = await releaseOf(w.tx, vehicleId)
    if (!release?.claimantKind) throw unprocessable("The claimant's ID is not recorded.", said('claimantIdMissing', undefined, { reasons: [{ code: 'claimant-id', message: "The claimant's ID is not recorded.", key: 'claimantId' }] }))
    const disposition = dispositionFor(release.claimantKind)
    const verdict = await judgeMove(w.tx, w.vehicle, w.yard, actor, { to: 'closed', disposition, reason: null }, now)
    if (!verdict.allowed) {
      const message = verdict.reasons.map((r) => r.message).join(' ')
      const words = said('notYetReasons', reasonParams(verdict.reasons), { reasons: verdict.reasons })
      throw verdict.forbidden ? new AppError(403, message, words) : unprocessable(message, words)
    }
    await w.tx
      .update(gatePasses)
      .set({ withdrawnAt: now })
      .where(and(eq(gatePasses.vehicleId, vehicleId), isNull(gatePasses.usedAt), isNull(gatePasses.withdrawnAt)))
    const [row] = await w.tx
      .insert(gatePasses)
      .values({ vehicleId, releaseId: release.id, disposition, tokenHash: gateHash('gate-token', token), codeHash: gateHash('gate-code', code), issuedById: actor.id, issuedAt: now, expiresAt })
      .returning({ id: gatePasses.id })
    w.record({ kind: 'gate_pass_issued', after: { passId: row!.id, disposition, expiresAt: expiresAt.toISOString() } })
    return row!.id
  })
  return { id: result, token, code, expiresAt }
}

type PassRow = typeof gatePasses.$inferSelect

const when = (d: Date, timeZone: string) => new Intl.DateTimeFormat('en-GB', { dateStyle: 'medium', timeStyle: 'short', timeZone }).format(d)

/** 404 for a pass that is not this company's (forged, mistyped); 410 for one that was used, replaced or has expired. */
function refusal(pass: PassRow | undefined, timeZone: string, now: Date): AppError | null {
  if (!pass) return new AppError(404, 'This pass is not one this yard issued: it may be forged or mistyped. Check the code, or ask the office.', said('passUnknown', undefined, { reason: 'unknown' }))
  if (pass.usedAt) return new AppError(410, `This pass was already used: the vehicle was recorded out on ${when(pass.usedAt, timeZone)}. A pass opens the gate once.`, said('passUsed', { at: pass.usedAt.toISOString(), timeZone }, { reason: 'used' }))
  if (pass.withdrawnAt) return new AppError(410, 'This pass was replaced by a newer one. Ask the office for the latest pass.', said('passWithdrawn', undefined, { reason: 'withdrawn' }))
  if (pass.expiresAt.getTime() <= now.getTime()) return new AppError(410, `This pass expired on ${when(pass.expiresAt, timeZone)}. The office issues a new one.`, said('passExpired', { at: pass.expiresAt.toISOString(), timeZone }, { reason: 'expired' }))
  return null
}

/** The pass the gate read, if it belongs to a vehicle of this staff member's company, with its yard's zone. */
async function findPass(db: Executor, user: User, value: string, lock = false) {
  const key = readPass(value)
  if (!key) return undefined
  const column = key.column === 'token' ? gatePasses.tokenHash : gatePasses.codeHash
  const query = db
    .select({ pass: gatePasses, timeZone: yards.timeZone })
    .from(gatePasses)
    .innerJoin(vehicles, eq(vehicles.id, gatePasses.vehicleId))
    .innerJoin(yards, eq(yards.id, vehicles.yardId))
    .where(and(eq(column, key.hash), yardOfStaff(user.id)))
  const [row] = lock ? await query.for('update', { of: gatePasses }) : await query
  return row
}

/** What the gate shows before recording the vehicle out: the vehicle, its photo and its space. */
export async function checkPass(db: Executor, user: User, value: string, now = new Date()): Promise<GateVehicle> {
  const found = await findPass(db, user, value)
  const refused = refusal(found?.pass, found?.timeZone ?? 'UTC', now)
  if (refused) throw refused
  const pass = found!.pass
  const { vehicle } = await vehicleForUser(db, user.id, pass.vehicleId)
  const release = await releaseOf(db, pass.vehicleId)
  return {
    passId: pass.id,
    vehicleId: vehicle.id,
    stockNumber: vehicle.stockNumber,
    year: vehicle.year,
    make: vehicle.make,
    model: vehicle.model,
    colour: vehicle.colour,
    plate: vehicle.plate,
    plateState: vehicle.plateState,
    space: (await spaceOf(db, vehicle.spaceId))?.label ?? null,
    photoUrl: await photoOf(db, vehicle.id),
    disposition: pass.disposition,
    claimantName: release?.claimantName ?? null,
    expiresAt: pass.expiresAt.toISOString(),
  }
}

/**
 * Records the vehicle out by its pass: in one transaction the vehicle is locked, the pass is taken
 * (once: a second scan finds it used) and the SAME lifecycle move closes the vehicle, its guards judged
 * again on facts read under the lock. A refused move leaves the pass unused.
 */
export async function recordOut(changes: VehicleChanges, user: User, value: string, now = new Date()): Promise<GateRecorded> {
  const seen = await findPass(changes.db, user, value)
  const early = refusal(seen?.pass, seen?.timeZone ?? 'UTC', now)
  if (early) throw early
  const vehicleId = seen!.pass.vehicleId
  const { result } = await changeVehicle(
    changes,
    user,
    vehicleId,
    async (w) => {
      const found = await findPass(w.tx, user, value, true)
      const refused = refusal(found?.pass, w.yard.timeZone, now)
      if (refused) throw refused
      const pass = found!.pass
      await w.tx.update(gatePasses).set({ usedAt: now, usedById: user.id }).where(eq(gatePasses.id, pass.id))
      await makeMove(w, { to: 'closed', disposition: pass.disposition, reason: null }, now, { gatePassId: pass.id })
      return { vehicleId, stockNumber: w.vehicle.stockNumber, state: 'closed' as const, disposition: pass.disposition, at: now.toISOString() }
    },
    { card: async (db, yard) => cardOf(db, yard, vehicleId, now) },
  )
  return result
}

