import type { Executor } from '@db/client'
import { pickupBadge } from '@shared/domain/inspection'
import type { HoldFact } from '@shared/domain/lifecycle'
import type { BoardCard } from '@shared/schemas/board'
import type { VehicleSummary } from '@shared/schemas/charges'
import type { MoneyTotals } from '../billing/index'
import { summarizeVehicles, type YardForCharges } from '../charges/index'
import { notFound } from '../errors'
import { yardOfUser } from '../yards/index'
import { activeHolds, activeInYard, cardRows, oneInYard, type CardRow, type HoldRow } from './board.queries'
import { handoverFacts } from './handover.queries'

export interface BoardYard extends YardForCharges {
  id: string
  name: string
}

// What is not recorded reads as such: every guard that needs it refuses with its reason. The money
// comes from its records (handoverMoney), the claimant's ID and the signature from the release's.
// No title transfer is recorded anywhere yet (issue 11), so signing a vehicle over is refused until it is.
export const NOTHING_RECORDED: BoardCard['handover'] = { paidCents: 0, creditedCents: 0, waived: false, claimantIdRecorded: false, releaseSigned: false, transferSigned: false, lienSaleSigned: false }

/** The money side of the handover: payments less refunds, approved waivers and discounts, against the balance. */
export function handoverMoney(totals: MoneyTotals | undefined, balanceCents: number | null): Pick<BoardCard['handover'], 'paidCents' | 'creditedCents' | 'waived'> {
  const paidCents = totals?.paidCents ?? 0
  const creditedCents = totals?.creditedCents ?? 0
  return { paidCents, creditedCents, waived: creditedCents > 0 && balanceCents !== null && balanceCents - creditedCents - paidCents <= 0 }
}

/** An active hold as the card shows it and the lifecycle judges it. */
export const holdFact = (h: HoldRow): HoldFact => ({ kind: h.kind, agency: h.agency, caseNumber: h.caseNumber, until: h.until?.toISOString() ?? null })

/** Every active vehicle of the yard as a card, oldest arrival first. */
export async function activeCards(db: Executor, yard: BoardYard, asOf: Date): Promise<BoardCard[]> {
  return cards(db, yard, asOf, await cardRows(db, activeInYard(yard.id)))
}

/** One vehicle of the yard as a card, whatever its state; undefined when it is not in this yard. */
export async function cardOf(db: Executor, yard: BoardYard, vehicleId: string, asOf: Date): Promise<BoardCard | undefined> {
  const [card] = await cards(db, yard, asOf, await cardRows(db, oneInYard(yard.id, vehicleId)), [vehicleId])
  return card
}

async function cards(db: Executor, yard: BoardYard, asOf: Date, rows: CardRow[], ids?: string[]): Promise<BoardCard[]> {
  if (rows.length === 0) return []
  const holdRows = await activeHolds(db, yard.id, ids)
  const summaries = await summarizeVehicles(db, yard, rows, asOf)
  const holdsByVehicle = new Map<string, BoardCard['holds']>()
  for (const h of holdRows) {
    const list = holdsByVehicle.get(h.vehicleId) ?? []
    list.push(holdFact(h))
    holdsByVehicle.set(h.vehicleId, list)
  }
  return rows.map((r) => ({
    id: r.id,
    stockNumber: r.stockNumber,
    year: r.year,
    make: r.make,
    model: r.model,
    colour: r.colour,
    plate: r.plate,
    plateState: r.plateState,
    state: r.state,
    disposition: r.disposition,
    vin: r.vin,
    version: r.version,
    arrivedAt: r.arrivedAt.toISOString(),
    towReason: r.towReason,
    space: r.spaceRow ? `${r.spaceRow}-${r.spaceNumber}` : null,
    rolls: r.rolls,
    inspectedAt: r.inspectedAt?.toISOString() ?? null,
    holds: holdsByVehicle.get(r.id) ?? [],
    handover: { ...NOTHING_RECORDED, ...handoverMoney({ paidCents: Number(r.paidCents), creditedCents: Number(r.creditedCents) }, summaries.get(r.id)?.balanceCents ?? null), ...handoverFacts(r) },
    photoCount: Number(r.photoCount),
    pickup: cardPickup(pickupBadge(r)),
    summary: cardSummary(summaries.get(r.id)),
    ownerChoice: r.ownerChoice && r.ownerChoiceAt ? { choice: r.ownerChoice, at: r.ownerChoiceAt.toISOString() } : null,
  }))
}

function cardSummary(summary: VehicleSummary | null | undefined): BoardCard['summary'] {
  if (!summary) return null
  const { warnings, sampleWarnings, nextDeadline, ...shown } = summary
  if (!nextDeadline) return { ...shown, nextDeadline }
  const { rules, ...deadline } = nextDeadline
  return { ...shown, nextDeadline: deadline }
}

function cardPickup(badge: ReturnType<typeof pickupBadge>): BoardCard['pickup'] {
  return badge && { label: badge.label, code: badge.code, technicianFirst: badge.technicianFirst }
}

/** The yard whose board this staff member sees. */
export async function boardYardOf(db: Executor, userId: string): Promise<BoardYard> {
  const yard = await yardOfUser(db, userId)
  if (!yard) throw notFound('A yard for your company')
  return yard
}
