import { randomUUID } from 'node:crypto'
import { and, eq } from 'drizzle-orm'
import type { Database } from '@db/client'
import { holds, propertyItems, tows, users, vehicles } from '@db/schema'
import { policeNoticeClock } from '@shared/domain/clocks'
import { TOW_REASON_LABELS } from '@shared/domain/tow'
import type { TowIn } from '@shared/schemas/tow-in'
import type { User } from '@shared/schemas/users'
import { badRequest, fieldIssue, notFound } from '../errors'
import { type FileStore, type Incoming, prepareUploads, putFiles, recordFiles, type StoredFile } from '../files/index'
import { freeSpace, isSpaceConflict, spaceTaken } from '../spaces/index'
import { yardOfUser } from '../yards/index'
import { activeLookalikes, assertNotLoggedTwice } from './duplicates'
import { assertKnownClass, intakeRules } from './rules'
import { nextStockNumber } from './stock-numbers'
import { towColumns } from './tow-charge'
import { createVehicle, type ChangeScope, type VehicleChanges } from './vehicle-change'
import type { YardRow } from './vehicles.queries'

/**
 * Logs a vehicle in: stock number, vehicle, tow, holds, property, space and photos in one
 * transaction, with the first links of its history. Photos are checked and stored first and
 * removed again if the transaction fails, so a refused tow-in leaves neither rows nor files.
 */
export async function createTowIn(changes: VehicleChanges, store: FileStore, actor: User, input: TowIn, photos: Incoming[]) {
  const { db } = changes
  const yard = await yardOfUser(db, actor.id)
  if (!yard) throw notFound('A yard for your company')
  const rules = await intakeRules(db, yard)
  assertKnownClass(rules.classes, input.vehicle.vehicleClass)
  await assertSameCompany(db, yard, input.condition.checkedById)
  const prepared = await prepareUploads(photos, 'photo', 'photos')
  const vehicleId = randomUUID()
  const { stored, discard } = await putFiles(store, vehicleId, prepared)
  try {
    const created = await createVehicle(changes, actor, yard, vehicleId, (scope) => insertTowIn(scope, yard, input, { ruleSetVersionId: rules.versionId, ruleSet: rules.ruleSet && { name: rules.ruleSet.name, version: rules.version }, photos: stored }))
    // A private-property tow starts the police clock now: the dispatcher sees it before leaving the form.
    const policeNotice = policeNoticeClock(rules.policeNotice ?? undefined, input.tow, null, new Date().toISOString())
    return { ...created, policeNotice }
  } catch (err) {
    await discard()
    if (isSpaceConflict(err)) throw spaceTaken(null, 'spaceId')
    throw err
  }
}

async function assertSameCompany(db: Database, yard: YardRow, userId: string) {
  const [found] = await db.select({ id: users.id }).from(users).where(and(eq(users.id, userId), eq(users.companyId, yard.companyId), eq(users.active, true)))
  const message = 'Choose who checked the vehicle from the staff list.'
  if (!found) throw badRequest(message, [fieldIssue('condition.checkedById', 'vehicles.checkedByFromStaff', message)])
}

interface Extras {
  ruleSetVersionId: string | null
  /** Named in the history: the rule set and version the vehicle is billed under. */
  ruleSet: { name: string; version: number | null } | null
  photos: StoredFile[]
}

async function insertTowIn(scope: ChangeScope, yard: YardRow, input: TowIn, extras: Extras) {
  const { tx, vehicleId, actor, now, record } = scope
  const { tow, vehicle: v, condition } = input
  // Inside the transaction, so the answer holds for this insert (one writer at a time on the embedded database).
  const lookalikes = await activeLookalikes(tx, yard, v)
  assertNotLoggedTwice(lookalikes, input.duplicateReason)
  const space = input.spaceId ? await freeSpace(tx, yard.id, input.spaceId, 'spaceId', undefined, v.vehicleClass) : null
  const towRow = towColumns(tow, yard)
  const stockNumber = await nextStockNumber(tx, yard, towRow.arrivedAt)
  await tx.insert(vehicles).values({
    id: vehicleId,
    yardId: yard.id,
    stockNumber,
    ...v,
    spaceId: input.spaceId,
    conditionNotes: condition.damageNotes,
    checkedById: condition.checkedById,
    ruleSetVersionId: extras.ruleSetVersionId,
    arrivedAt: towRow.arrivedAt,
    createdAt: now,
    updatedAt: now,
  })
  await tx.insert(tows).values({ vehicleId, ...towRow, createdAt: now })
  if (condition.property.length > 0) {
    await tx.insert(propertyItems).values(condition.property.map((p) => ({ vehicleId, ...p })))
  }
  record({
    kind: 'towed_in',
    toState: 'arrival',
    reason: TOW_REASON_LABELS[tow.reason],
    after: {
      stockNumber,
      vin: v.vin,
      plate: v.plate,
      vehicle: [v.year, v.make, v.model, v.colour].filter(Boolean).join(' '),
      vehicleClass: v.vehicleClass,
      pickup: tow.pickup.address ?? `${tow.pickup.lat.toFixed(5)}, ${tow.pickup.lng.toFixed(5)}`,
      chargeCents: towRow.chargeCents,
      space,
      propertyItems: condition.property.length,
      ruleSet: extras.ruleSet?.name ?? null,
      ruleSetVersion: extras.ruleSet?.version ?? null,
      ...(lookalikes.length > 0 ? { alsoOnTheLot: lookalikes.map((l) => l.stockNumber), whySeparate: input.duplicateReason } : {}),
    },
  })
  for (const h of input.holds) {
    const [row] = await tx.insert(holds).values({ vehicleId, ...h, until: h.until ? new Date(h.until) : null, setById: actor.id, setAt: now }).returning({ id: holds.id })
    record({ kind: 'hold_set', after: { holdId: row!.id, kind: h.kind, agency: h.agency, caseNumber: h.caseNumber, until: h.until, note: h.note } })
  }
  await recordFiles(scope, extras.photos)
  return { id: vehicleId, stockNumber }
}
