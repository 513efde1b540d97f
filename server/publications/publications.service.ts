import { ruleWord } from '@shared/messages/rule-words'
import { and, asc, eq } from 'drizzle-orm'
import type { Executor } from '@db/client'
import { publications } from '@db/schema'
import { nextStepDate, plannedPublication, PUBLICATION_EVENT } from '@shared/domain/notices'
import { dayFromIsoDate, isoDate, localDay, startOfLocalDay } from '@shared/domain/time'
import { publicationInputSchema, type PublicationInput, type PublicationsPage } from '@shared/schemas/publications'
import type { User } from '@shared/schemas/users'
import { addClockEvent, vehicleClocks } from '../clock-events/index'
import type { Language } from '../documents/index'
import { badRequest, conflict, fieldIssue, notFound, unprocessable, said } from '../errors'
import { prepareUploads, putFiles, recordFiles, type FileStore, type Incoming } from '../files/index'
import { changeVehicle, vehicleForUser, type VehicleChanges, type VehicleRow, type YardRow } from '../vehicles/index'
import { publicationText } from './publication-text'

async function planOf(db: Executor, vehicle: VehicleRow, yard: YardRow, now: Date) {
  const worked = await vehicleClocks(db, vehicle, yard, now)
  return worked ? { plan: plannedPublication(worked.clocks, isoDate(localDay(yard.timeZone, now.getTime()))), clocks: worked.clocks } : { plan: null, clocks: null }
}

export async function publicationsPage(db: Executor, user: User, vehicleId: string, now = new Date()): Promise<PublicationsPage> {
  const { vehicle, yard } = await vehicleForUser(db, user.id, vehicleId)
  const rows = await db.select().from(publications).where(eq(publications.vehicleId, vehicleId)).orderBy(asc(publications.createdAt))
  return {
    vehicleId,
    plan: (await planOf(db, vehicle, yard, now)).plan,
    publications: rows.map((r) => ({ id: r.id, newspaper: r.newspaper, days: r.days, proofFileId: r.proofFileId, recordedAt: r.createdAt.toISOString() })),
  }
}

/**
 * The newspaper and the days the notice ran. Only where the rule set's branch has a publication step;
 * no day in the future; the first day is the clock event that meets (or misses) the window, in the
 * same change as the record and its history event.
 */
export async function recordPublication(changes: VehicleChanges, actor: User, vehicleId: string, raw: PublicationInput, now = new Date()) {
  const input = publicationInputSchema.parse(raw)
  return changeVehicle(changes, actor, vehicleId, async (w) => {
    if (w.vehicle.state === 'closed') throw conflict(`${w.vehicle.stockNumber} has left the yard.`, said('closedPublication', { stock: w.vehicle.stockNumber }))
    const zone = w.yard.timeZone
    const today = localDay(zone, now.getTime())
    const days = input.days.map((d, i) => {
      const n = dayFromIsoDate(d, `days.${i}`)
      if (n > today) throw badRequest('A day of publication cannot be in the future.', [fieldIssue(`days.${i}`, 'publications.dayInFuture', 'A day of publication cannot be in the future.')])
      return n
    })
    const sorted = [...days].sort((a, b) => a - b)
    const { plan } = await planOf(w.tx, w.vehicle, w.yard, now)
    if (!plan) throw unprocessable("This vehicle's rule set asks for no newspaper publication.", said('noPublication'))
    const [row] = await w.tx
      .insert(publications)
      .values({ vehicleId, newspaper: input.newspaper, days: sorted.map(isoDate), createdById: actor.id })
      .returning()
    await addClockEvent(w.tx, { vehicleId, kind: PUBLICATION_EVENT, at: new Date(startOfLocalDay(zone, sorted[0]!)), source: 'publication', sourceId: row!.id, recordedById: actor.id })
    w.record({ kind: 'publication_recorded', after: { publicationId: row!.id, newspaper: input.newspaper, days: sorted.map(isoDate) } })
    return row!
  })
}

/** The publisher's affidavit or proof of publication: a PDF or a photo, under the upload rules. */
export async function addPublicationProof(changes: VehicleChanges, store: FileStore, actor: User, vehicleId: string, publicationId: string, incoming: Incoming[]) {
  if (incoming.length !== 1) throw badRequest('Choose the affidavit or proof of publication: one file.', [fieldIssue('files', 'publications.oneProofFile', 'Choose the affidavit or proof of publication: one file.')])
  const prepared = await prepareUploads(incoming, 'document', 'files', 'Proof of publication')
  const { stored, discard } = await putFiles(store, vehicleId, prepared)
  try {
    await changeVehicle(changes, actor, vehicleId, async (w) => {
      const [row] = await w.tx.select().from(publications).where(and(eq(publications.id, publicationId), eq(publications.vehicleId, vehicleId)))
      if (!row) throw notFound('That publication')
      await recordFiles(w, stored)
      await w.tx.update(publications).set({ proofFileId: stored[0]!.id }).where(eq(publications.id, row.id))
      w.record({ kind: 'publication_proof_added', after: { publicationId: row.id, fileId: stored[0]!.id, sha256: stored[0]!.sha256 } })
    })
  } catch (err) {
    await discard()
    throw err
  }
}

/** The text to send the newspaper. */
export async function publicationNoticeText(db: Executor, user: User, vehicleId: string, language: Language, now = new Date()) {
  const { vehicle, yard } = await vehicleForUser(db, user.id, vehicleId)
  const { plan, clocks } = await planOf(db, vehicle, yard, now)
  // No publication asked (yet, or any more: a value just recorded can take a vehicle out of it): no text.
  if (!plan) return { stockNumber: vehicle.stockNumber, text: '' }
  // Clocks that cannot run yet (no value recorded) leave the sale's day blank in the text, to fill in later.
  return { stockNumber: vehicle.stockNumber, text: publicationText({ yard, vehicle, saleNotBefore: clocks ? nextStepDate(clocks) : null, citation: ruleWord(plan, 'citation', language) }, language) }
}
