import { COLUMN_LABELS, type VehicleState } from './columns'
import { HOLD_LABELS, type HoldKind } from './hold-kinds'
import type { LienSaleGate } from '../clocks/lien-sale-gate'
import { formatCents } from '../billing/money'

export interface HoldFact {
  kind: HoldKind
  agency: string | null
  caseNumber: string | null
  /** The date the placing agency gave, if any; a hold blocks until it is lifted, date or not. */
  until: string | null
}

/**
 * What the server knows about a vehicle when someone moves it. Features that have not landed
 * (the claimant's ID, the signed release) read as "not recorded" until they do.
 */
export interface MoveFacts {
  timeZone: string
  /** Active holds only. */
  holds: readonly HoldFact[]
  inspected: boolean
  /** The running balance; null when no rule set bills the vehicle (and on the server when the move does not read it: readsBill). */
  balanceCents: number | null
  /** Payments less refunds. */
  paidCents: number
  /** Waivers and discounts a manager approved, with a reason. */
  creditedCents: number
  /** Nothing is left to pay and a manager's waiver or discount is part of why. */
  waived: boolean
  claimantIdRecorded: boolean
  releaseSigned: boolean
  /** The signed title transfer: a release signed for a hand-over does not sign a vehicle over. */
  transferSigned: boolean
  /** The lien sale recorded (buyer, price, how the proceeds were applied) and its bill of sale signed. */
  lienSaleSigned: boolean
  /** Null when no rule set gives the vehicle legal clocks (or the move does not read it, as the balance). */
  lienSale: LienSaleGate | null
}

export type ReasonCode =
  | 'not-a-move' | 'role' | 'hold' | 'inspection' | 'balance' | 'claimant-id' | 'release-signed'
  | 'lien-sale' | 'disposition' | 'reason'

export interface Reason {
  code: ReasonCode
  message: string
  /** The words in the reader's language: a key under `refusals.reasons` in shared/messages and its parameters (codes, cents, dates). */
  key?: string
  params?: Record<string, string | number>
}

export interface GuardContext {
  to: VehicleState
  now: Date
}

export type Guard = (facts: MoveFacts, ctx: GuardContext) => Reason[]

// A date-only value ("2026-12-12") is a calendar day; an instant is shown on the yard's calendar.
function shortDate(value: string, timeZone: string, now: Date): string {
  const dateOnly = /^\d{4}-\d{2}-\d{2}$/.test(value)
  const zone = dateOnly ? 'UTC' : timeZone
  const at = new Date(dateOnly ? `${value}T12:00:00Z` : value)
  const year = (d: Date, z: string) => new Intl.DateTimeFormat('en-GB', { year: 'numeric', timeZone: z }).format(d)
  const showYear = year(at, zone) !== year(now, timeZone)
  return new Intl.DateTimeFormat('en-GB', { day: 'numeric', month: 'short', year: showYear ? 'numeric' : undefined, timeZone: zone }).format(at)
}

const destination = (to: VehicleState) => (to === 'closed' ? 'be closed' : `go to ${COLUMN_LABELS[to]}`)

/** "Law-enforcement hold (Orrin Flats Police Department, case OF-26-11873) until 12 Dec". */
export function describeHold(h: HoldFact, timeZone: string, now: Date): string {
  const who = [h.agency, h.caseNumber && `case ${h.caseNumber}`].filter(Boolean).join(', ')
  const what = `${HOLD_LABELS[h.kind]}${who ? ` (${who})` : ''}`
  if (!h.until) return what
  const when = shortDate(h.until, timeZone, now)
  return new Date(h.until).getTime() > now.getTime() ? `${what} until ${when}` : `${what}, set until ${when} and not yet lifted`
}

/** The day a hold was set until, in the yard's zone (YYYY-MM-DD), for the reader's own date format. */
function yardDay(value: string, timeZone: string): string {
  if (/^\d{4}-\d{2}-\d{2}$/.test(value)) return value
  return new Intl.DateTimeFormat('en-CA', { timeZone, year: 'numeric', month: '2-digit', day: '2-digit' }).format(new Date(value))
}

export const noActiveHold: Guard = (f, ctx) =>
  f.holds.map((h) => ({
    code: 'hold',
    message: `${describeHold(h, f.timeZone, ctx.now)} — it cannot ${destination(ctx.to)}.`,
    key: ctx.to === 'closed' ? (h.until ? 'holdCloseUntil' : 'holdClose') : h.until ? 'holdUntil' : 'hold',
    params: { hold: h.kind, who: h.agency || h.caseNumber ? ` (${[h.agency, h.caseNumber].filter(Boolean).join(', ')})` : '', column: ctx.to, ...(h.until ? { date: yardDay(h.until, f.timeZone) } : {}) },
  }))

export const inspectionFinished: Guard = (f) =>
  f.inspected ? [] : [{ code: 'inspection', message: 'The inspection is not finished — the technician finishes it in Teardown first.', key: 'inspection' }]

export const balanceSettled: Guard = (f) => {
  if (f.waived) return []
  if (f.balanceCents === null) return [{ code: 'balance', message: 'No rule set bills this vehicle, so its balance cannot be settled.', key: 'noBill' }]
  const due = f.balanceCents - f.creditedCents - f.paidCents
  if (due <= 0) return []
  return [{ code: 'balance', message: `Balance unpaid: ${formatCents(due)} due. Take the payment, or a manager waives it with a reason.`, key: 'balance', params: { dueCents: due } }]
}

export const claimantIdRecorded: Guard = (f) =>
  f.claimantIdRecorded ? [] : [{ code: 'claimant-id', message: "The claimant's ID is not recorded.", key: 'claimantId' }]

export const releaseSigned: Guard = (f) => (f.releaseSigned ? [] : [{ code: 'release-signed', message: 'The release is not signed.', key: 'releaseSigned' }])

export const transferSigned: Guard = (f) =>
  f.transferSigned ? [] : [{ code: 'release-signed', message: 'The title transfer is not signed.', key: 'transferSigned' }]

export const lienSaleSigned: Guard = (f) =>
  f.lienSaleSigned ? [] : [{ code: 'release-signed', message: 'The lien sale is not recorded and signed: record the buyer, the price and the proceeds, then sign the bill of sale.', key: 'lienSaleSigned' }]

export const lienSaleAllowed: Guard = (f, ctx) => {
  const gate = f.lienSale
  if (!gate) return [{ code: 'lien-sale', message: 'No rule set gives this vehicle a lien-sale date, so the law has not been shown to allow a sale or disposal.', key: 'lienSaleNoDate' }]
  if (gate.open) return []
  if (gate.code === 'not-before' && gate.date) {
    return [{ code: 'lien-sale', message: `The law does not allow a lien sale or disposal before ${shortDate(gate.date, f.timeZone, ctx.now)}.`, key: 'lienSaleBefore', params: { date: gate.date } }]
  }
  return [{ code: 'lien-sale', message: `The law has not been shown to allow a lien sale or disposal yet. ${gate.why}`, key: 'lienSaleNotYet' }]
}

/**
 * The guards that read the vehicle's bill (its balance, its lien-sale gate). Working the bill out
 * is the dear part of a move's facts, so the server does it only for a move one of these judges.
 */
export const BILL_GUARDS: ReadonlySet<Guard> = new Set([balanceSettled, lienSaleAllowed])
