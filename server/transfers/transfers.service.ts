import { and, eq, sql } from 'drizzle-orm'
import { files, payments, titleTransfers } from '@db/schema'
import type { Executor } from '@db/client'
import { applyProceeds } from '@shared/domain/billing'
import { dayFromIsoDate, localDay, startOfLocalDay } from '@shared/domain/time'
import { dayIn } from '@shared/schemas/releases'
import type { SignatureInput } from '@shared/schemas/releases'
import type { TransferInput, TransferPage } from '@shared/schemas/transfers'
import { transferInputSchema } from '@shared/schemas/transfers'
import type { User } from '@shared/schemas/users'
import type { OdometerDecision } from '@shared/domain/vehicle'
import type { FieldCode, FieldParams } from '@shared/schemas/field-messages'
import { moveFacts } from '../board/index'
import { transferPacket, type Language } from '../documents/index'
import { badRequest, conflict, fieldIssue, notFound, unprocessable, said } from '../errors'
import { prepareUploads, putFiles, recordFiles, type FileStore } from '../files/index'
import { signatureImage } from '../releases/index'
import { changeVehicle, vehicleForUser, type VehicleChanges, type VehicleRow, type VehicleWork } from '../vehicles/index'
import { odometerRule, transferOf, transferRecord, type TransferRow } from './transfers.queries'

const field = (...issue: Parameters<typeof fieldIssue>) => badRequest(issue[2], [fieldIssue(...issue)])

const SALE_FIRST = 'Record the buyer, the price and the date before the bill of sale is signed.'

/** Why an odometer reading is needed (49 CFR 580.17 by the rule's clause), as a field issue's code, English and parameters. */
function odometerNeeded(rule: OdometerDecision): [FieldCode, string, FieldParams?] {
  const message = `Enter the odometer reading: ${rule.reason}`
  if (!rule.exemptFrom) return ['transfers.odometerNoYear', message]
  const { year, clause, band } = rule.exemptFrom
  return [band === 'older' ? 'transfers.odometerOlder' : 'transfers.odometerNewer', message, { year: String(year), clause }]
}

/** A transfer is recorded while the vehicle waits in Storage or Release, and changes until it is signed. */
function mustBeOpen(vehicle: VehicleRow, row: TransferRow | undefined, action: string) {
  if (vehicle.state === 'closed') throw conflict(`${vehicle.stockNumber} has left the yard: its transfer can no longer change.`, said('closedTransfer', { stock: vehicle.stockNumber }))
  if (vehicle.state !== 'storage' && vehicle.state !== 'release') throw unprocessable(`Move ${vehicle.stockNumber} to Storage or Release first, then ${action}.`, said('storageOrReleaseFirst', { stock: vehicle.stockNumber }))
  if (row?.signedAt) throw conflict('The bill of sale is signed: what it records can no longer change.', said('billOfSaleSigned'))
}

/**
 * The buyer, price and date of a sign-over or a lien sale, and the odometer facts 49 CFR 580.17 reads.
 * A lien sale may not be dated before the day the rule set's clocks open the sale (nor recorded while
 * they keep it shut), and its price is applied to what was owed that day: charges first, any surplus
 * the owner's. Recorded again (a corrected price or buyer) until the bill of sale is signed.
 */
export async function recordTransfer(changes: VehicleChanges, actor: User, vehicleId: string, raw: TransferInput, now = new Date()) {
  const input = transferInputSchema.parse(raw)
  await changeVehicle(changes, actor, vehicleId, async (w: VehicleWork) => {
    const before = await transferOf(w.tx, vehicleId)
    mustBeOpen(w.vehicle, before, 'record the transfer')
    const zone = w.yard.timeZone
    const day = dayFromIsoDate(input.date, 'date')
    if (day > localDay(zone, now.getTime())) throw field('date', 'transfers.saleInFuture', 'The date of the sale cannot be in the future: record a sale once it is held.')
    if (day < localDay(zone, w.vehicle.arrivedAt.getTime())) throw field('date', 'transfers.saleBeforeArrival', 'The date of the sale cannot be before the vehicle arrived.')
    const rule = odometerRule(w.vehicle.year, { gvwrLb: input.gvwrLb, selfPropelled: input.selfPropelled, date: input.date })
    if (rule.required && input.odometer === null && !input.odometerUnreadable) {
      throw field('odometer', ...odometerNeeded(rule))
    }
    if (input.odometer !== null && w.vehicle.odometer !== null && input.odometer < w.vehicle.odometer) {
      const intake = w.vehicle.odometer.toLocaleString('en-US')
      throw field('odometer', 'transfers.odometerBelowIntake', `The odometer cannot read less than at intake (${intake}).`, { intake })
    }
    // A sale recorded again (a corrected price, or no longer a lien sale): its earlier proceeds are taken
    // off the bill first, as a reversing line (the ledger is never edited), then applied afresh below.
    const reversed = await reverseProceeds(w, actor)
    let proceeds: ReturnType<typeof applyProceeds> | null = null
    if (input.kind === 'lien_sale') {
      // The gate as the clocks stand today; a computed date never lets the yard sell earlier than the law allows.
      const gate = (await moveFacts(w.tx, w.vehicle, w.yard, true, now)).lienSale
      if (!gate) throw field('date', 'transfers.noLienSaleDate', 'No rule set gives this vehicle a lien-sale date, so the law has not been shown to allow a sale.')
      if (gate.date && input.date < gate.date) {
        const rule = `${gate.step ?? 'the rule set'}${gate.citation ? `, ${gate.citation}` : ''}`
        const es = gate.es && `${gate.es.step ?? gate.step ?? 'las reglas'}${(gate.es.citation ?? gate.citation) ? `, ${gate.es.citation ?? gate.citation}` : ''}`
        throw field('date', 'transfers.saleBeforeLaw', `The law allows the lien sale from ${gate.date} (${rule}); ${input.date} is earlier.`, { date: gate.date, rule, ...(es ? { ruleEs: es } : {}), day: input.date })
      }
      if (!gate.open) throw field('date', 'transfers.saleNotOpen', `The law has not been shown to allow a lien sale yet. ${gate.why}`, { why: gate.why, gate: gate.code, ...(gate.date ? { date: gate.date } : {}) })
      // What was owed at the end of the sale day (or now, for a sale today).
      const asOf = new Date(Math.min(now.getTime(), startOfLocalDay(zone, day + 1)))
      const facts = await moveFacts(w.tx, w.vehicle, w.yard, true, asOf)
      const due = Math.max(0, (facts.balanceCents ?? 0) - facts.creditedCents - facts.paidCents)
      proceeds = applyProceeds(input.priceCents, due)
    }
    const values = {
      kind: input.kind,
      sellerName: input.sellerName,
      buyerKind: input.buyerKind,
      buyerName: input.buyerName,
      buyerAddress: input.buyerAddress,
      buyerIdType: input.buyerKind === 'yard' ? null : input.buyerIdType,
      buyerIdNumber: input.buyerKind === 'yard' ? null : input.buyerIdNumber,
      priceCents: input.priceCents,
      saleDate: input.date,
      odometer: input.odometer,
      odometerUnreadable: input.odometerUnreadable,
      gvwrLb: input.gvwrLb,
      selfPropelled: input.selfPropelled,
      dueCents: proceeds?.dueCents ?? null,
      appliedCents: proceeds?.appliedCents ?? null,
      surplusCents: proceeds?.surplusCents ?? null,
      shortfallCents: proceeds?.shortfallCents ?? null,
      updatedAt: now,
    }
    if (before) await w.tx.update(titleTransfers).set(values).where(eq(titleTransfers.id, before.id))
    else await w.tx.insert(titleTransfers).values({ ...values, vehicleId, createdById: actor.id })
    // The proceeds pay the charges: one payment line of method lien_sale, in this same transaction.
    const proceedsPaymentId = proceeds && proceeds.appliedCents > 0 ? await postProceeds(w, actor, proceeds) : null
    // The buyer's ID appears in the history by its last four characters only, as the release's does.
    const summary = (t: Pick<TransferRow, 'kind' | 'buyerKind' | 'buyerName' | 'buyerIdNumber' | 'priceCents' | 'saleDate' | 'odometer'>) => ({
      kind: t.kind,
      buyerKind: t.buyerKind,
      buyerName: t.buyerName,
      buyerId: t.buyerIdNumber ? `…${t.buyerIdNumber.slice(-4)}` : null,
      priceCents: t.priceCents,
      date: t.saleDate,
      odometer: t.odometer,
    })
    w.record({ kind: 'transfer_recorded', before: before ? summary(before) : null, after: { ...summary(values), proceeds, proceedsPaymentId, proceedsReversedCents: reversed || null, odometerDisclosure: rule.required, odometerClause: rule.clause } })
  })
}

/** What earlier recordings of a lien sale applied to the bill and is still on it (payments less reversals). */
async function proceedsOnBill(w: VehicleWork) {
  const rows = await w.tx.select().from(payments).where(and(eq(payments.vehicleId, w.vehicle.id), eq(payments.method, 'lien_sale')))
  return { count: rows.length, cents: rows.reduce((sum, p) => sum + (p.kind === 'payment' ? p.amountCents : -p.amountCents), 0) }
}

async function reverseProceeds(w: VehicleWork, actor: User): Promise<number> {
  const on = await proceedsOnBill(w)
  if (on.cents <= 0) return 0
  const due = await dueNow(w)
  await w.tx.insert(payments).values({
    vehicleId: w.vehicle.id,
    kind: 'refund',
    method: 'lien_sale',
    amountCents: on.cents,
    reason: 'The sale was recorded again: its earlier proceeds come off the bill.',
    idempotencyKey: `lien-sale-proceeds:${on.count + 1}`,
    requestHash: 'lien-sale-proceeds',
    dueBeforeCents: due,
    takenById: actor.id,
    // The statement's own clock (not the transaction's), so the reversal lists before the new proceeds.
    takenAt: sql`clock_timestamp()`,
  })
  return on.cents
}

async function postProceeds(w: VehicleWork, actor: User, proceeds: ReturnType<typeof applyProceeds>): Promise<string> {
  const on = await proceedsOnBill(w)
  const [row] = await w.tx
    .insert(payments)
    .values({
      vehicleId: w.vehicle.id,
      kind: 'payment',
      method: 'lien_sale',
      amountCents: proceeds.appliedCents,
      idempotencyKey: `lien-sale-proceeds:${on.count + 1}`,
      requestHash: 'lien-sale-proceeds',
      dueBeforeCents: proceeds.dueCents,
      takenById: actor.id,
      takenAt: sql`clock_timestamp()`,
    })
    .returning({ id: payments.id })
  return row!.id
}

/** What is owed now, as the move guards read it (charges less credits less payments). */
async function dueNow(w: VehicleWork): Promise<number> {
  const facts = await moveFacts(w.tx, w.vehicle, w.yard, true, new Date())
  return Math.max(0, (facts.balanceCents ?? 0) - facts.creditedCents - facts.paidCents)
}

/** The seller's signature on the bill of sale: the transfer's guard opens once it is captured. */
export async function signTransfer(changes: VehicleChanges, store: FileStore, actor: User, vehicleId: string, input: SignatureInput, now = new Date()) {
  const png = await signatureImage(input.image)
  const { vehicle } = await vehicleForUser(changes.db, actor.id, vehicleId)
  const first = await transferOf(changes.db, vehicleId)
  mustBeOpen(vehicle, first, 'sign the bill of sale')
  if (!first) throw unprocessable(SALE_FIRST, said('billOfSaleMissing'))
  const prepared = await prepareUploads([{ buffer: png, originalname: 'signature.png' }], 'document', 'image', 'Signature on the bill of sale')
  const { stored, discard } = await putFiles(store, vehicleId, prepared)
  try {
    await changeVehicle(changes, actor, vehicleId, async (w) => {
      const row = await transferOf(w.tx, vehicleId)
      mustBeOpen(w.vehicle, row, 'sign the bill of sale')
      if (!row) throw unprocessable(SALE_FIRST, said('billOfSaleMissing'))
      await recordFiles(w, stored)
      await w.tx
        .update(titleTransfers)
        .set({ signatureFileId: stored[0]!.id, signerName: input.signerName, signedAt: now })
        .where(and(eq(titleTransfers.id, row.id)))
      w.record({ kind: 'transfer_signed', after: { kind: row.kind, signerName: input.signerName, fileId: stored[0]!.id, sha256: stored[0]!.sha256 } })
    })
  } catch (err) {
    await discard()
    throw err
  }
}

export async function transferPage(db: Executor, user: User, vehicleId: string, now = new Date()): Promise<TransferPage> {
  const { vehicle, yard } = await vehicleForUser(db, user.id, vehicleId)
  const row = await transferOf(db, vehicleId)
  const open = vehicle.state === 'storage' || vehicle.state === 'release'
  const gate = open ? (await moveFacts(db, vehicle, yard, true, now)).lienSale : null
  return {
    vehicleId,
    state: vehicle.state,
    version: vehicle.version,
    today: dayIn(yard.timeZone, now),
    intakeOdometer: vehicle.odometer,
    modelYear: vehicle.year,
    record: row ? transferRecord(row, vehicle.year) : null,
    lienSale: gate,
    editable: open && !row?.signedAt,
  }
}

async function storedBytes(db: Executor, store: FileStore, fileId: string): Promise<Uint8Array> {
  const [file] = await db.select({ key: files.storageKey }).from(files).where(eq(files.id, fileId))
  const { stream } = await store.get(file!.key)
  const chunks: Buffer[] = []
  for await (const chunk of stream) chunks.push(chunk as Buffer)
  return Buffer.concat(chunks)
}

/** The packet as the record stands: unsigned lines to sign by hand, or the seller's captured signature. */
export async function transferPacketPdf(db: Executor, store: FileStore, user: User, vehicleId: string, language: Language, now = new Date()) {
  const { vehicle, yard } = await vehicleForUser(db, user.id, vehicleId)
  const row = await transferOf(db, vehicleId)
  if (!row) throw notFound('A recorded transfer for this vehicle')
  const record = transferRecord(row, vehicle.year)
  const pdf = await transferPacket(
    {
      yard,
      vehicle,
      transfer: { ...record },
      odometer: record.odometerDisclosure,
      proceeds: record.proceeds,
      signature: row.signatureFileId && row.signedAt && row.signerName ? { image: await storedBytes(db, store, row.signatureFileId), signerName: row.signerName, signedAt: row.signedAt } : null,
      printedAt: now,
    },
    language,
  )
  return { pdf, stockNumber: vehicle.stockNumber }
}
