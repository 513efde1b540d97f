import type { Fee, RuleSet, Source } from '../schemas/rule-sets'
import { isoInstant } from './calendar-dates'
import { countStorageDays, type DayCount } from './day-count'
import { DomainError } from './errors'
import { assertTimeZone, type Instant, MS_PER_DAY, toEpochMs } from './local-time'
import { type Cents, taxOnLine, times } from './money'

export type FeeEvent = { fee: string; at: Instant }

export type StayInput = {
  arrivedAt: Instant
  releasedAt?: Instant | null
  vehicleClass: string
  feeEvents?: readonly FeeEvent[]
}

export type BillLine = {
  kind: 'storage' | 'fee'
  code: string
  label: string
  quantity: number
  unitCents: Cents
  amountCents: Cents
  taxCents: Cents
  reason: string
  source: Source
  /** The amount is a sample the yard has not set yet. */
  placeholder: boolean
}

export type StorageBill = {
  ruleSetId: string
  timeZone: string
  vehicleClass: string
  arrivedAt: string
  /** Release, or the as-of instant if that comes first (a running bill). */
  endsAt: string
  endedBy: 'release' | 'as-of'
  days: number
  dayCount: DayCount
  lines: BillLine[]
  subtotalCents: Cents
  taxCents: Cents
  totalCents: Cents
  taxRatePercent: number
  warnings: string[]
  caution: string
}

/** Longer than any lawful storage before a lien sale; beyond it the input is a typing slip. */
const MAX_STAY_MS = 20 * 366 * MS_PER_DAY

export type BillOptions = { timeZone?: string }

/**
 * The storage bill of one stay as of an instant: storage by the rule set's day count and the
 * vehicle class's daily rate, the one-off fees, and tax per line (money.ts says how it rounds).
 */
export function storageBill(stay: StayInput, ruleSet: RuleSet, asOf: Instant, options: BillOptions = {}): StorageBill {
  const zone = options.timeZone ?? ruleSet.timeZone
  assertTimeZone(zone)
  const arrival = toEpochMs(stay.arrivedAt, 'arrivedAt')
  const asOfMs = toEpochMs(asOf, 'asOf')
  const release = stay.releasedAt == null ? undefined : toEpochMs(stay.releasedAt, 'releasedAt')
  if (release !== undefined && release < arrival) {
    throw new DomainError('release-before-arrival', 'The release time is before the arrival time.', 'releasedAt')
  }
  if (asOfMs < arrival) {
    throw new DomainError('as-of-before-arrival', 'The bill is asked for a moment before the vehicle arrived.', 'asOf')
  }
  const endedBy = release !== undefined && release <= asOfMs ? 'release' : 'as-of'
  const end = endedBy === 'release' ? (release as number) : asOfMs
  if (end - arrival > MAX_STAY_MS) {
    throw new DomainError('stay-too-long', 'The stay is longer than 20 years: check the arrival date.', 'arrivedAt')
  }
  const vehicleClass = ruleSet.vehicleClasses.find((c) => c.code === stay.vehicleClass)
  if (!vehicleClass) {
    const known = ruleSet.vehicleClasses.map((c) => c.label).join(', ')
    throw new DomainError(
      'unknown-vehicle-class',
      `"${stay.vehicleClass}" is not a vehicle class of ${ruleSet.name} (its classes: ${known}).`,
      'vehicleClass',
    )
  }

  const dayCount = countStorageDays(arrival, end, ruleSet.storage, zone)
  const rate = ruleSet.tax.ratePercent
  const lines: BillLine[] = [storageLine(dayCount, vehicleClass, ruleSet, rate)]
  for (const [fee, quantity] of feeQuantities(stay.feeEvents ?? [], ruleSet, arrival, end)) {
    const amountCents = times(fee.amountCents, quantity, fee.code)
    lines.push({
      kind: 'fee',
      code: fee.code,
      label: fee.label,
      quantity,
      unitCents: fee.amountCents,
      amountCents,
      taxCents: fee.taxable ? taxOnLine(amountCents, rate) : 0,
      reason: fee.charged === 'once-per-stay' ? 'Charged once for the stay.' : `Charged each time: ${quantity} recorded.`,
      source: fee.source,
      placeholder: fee.placeholder,
    })
  }

  let subtotalCents = 0
  let taxCents = 0
  const warnings: string[] = []
  for (const line of lines) {
    subtotalCents += line.amountCents
    taxCents += line.taxCents
    if (line.placeholder) warnings.push(`${line.label}: the amount is a sample — set your rate.`)
  }
  if (ruleSet.tax.placeholder && taxCents > 0) warnings.push('The tax rate is a sample — set your rate.')
  return {
    ruleSetId: ruleSet.id,
    timeZone: zone,
    vehicleClass: vehicleClass.code,
    arrivedAt: isoInstant(arrival),
    endsAt: isoInstant(end),
    endedBy,
    days: dayCount.days,
    dayCount,
    lines,
    subtotalCents,
    taxCents,
    totalCents: subtotalCents + taxCents,
    taxRatePercent: rate,
    warnings,
    caution: ruleSet.caution,
  }
}

function storageLine(
  dayCount: DayCount,
  vehicleClass: RuleSet['vehicleClasses'][number],
  ruleSet: RuleSet,
  rate: number,
): BillLine {
  let amountCents = times(vehicleClass.dailyRateCents, dayCount.days, 'storage')
  const reasons = dayCount.steps.map((s) => s.says)
  const cap = ruleSet.storage.cap
  if (cap?.maxStorageCents !== undefined && amountCents > cap.maxStorageCents) {
    amountCents = cap.maxStorageCents
    reasons.push('Storage is capped at the rule set’s maximum charge.')
  }
  return {
    kind: 'storage',
    code: 'storage',
    label: textOf(vehicleClass, () => `${vehicleClass.label} storage`),
    quantity: dayCount.days,
    unitCents: vehicleClass.dailyRateCents,
    amountCents,
    taxCents: ruleSet.storage.taxable ? taxOnLine(amountCents, rate) : 0,
    reason: reasons.join(' '),
    source: vehicleClass.source,
    placeholder: vehicleClass.placeholder,
  }
}

// Texts that depend only on a rule set's class or fee are made once per rule set object.
const texts = new WeakMap<object, string>()

function textOf(owner: object, make: () => string): string {
  let text = texts.get(owner)
  if (text === undefined) {
    text = make()
    texts.set(owner, text)
  }
  return text
}

/** How many of each fee the stay owes up to `end`, in the rule set's order. */
function feeQuantities(events: readonly FeeEvent[], ruleSet: RuleSet, arrival: number, end: number): [Fee, number][] {
  const counts = new Map<string, number>()
  for (const event of events) {
    const fee = ruleSet.fees.find((f) => f.code === event.fee)
    if (!fee || fee.charged !== 'per-event') {
      throw new DomainError(
        'unknown-fee',
        fee
          ? `${fee.label} is charged once per stay; it is not recorded as an event.`
          : `"${event.fee}" is not a fee of ${ruleSet.name}.`,
        'feeEvents',
      )
    }
    const at = toEpochMs(event.at, 'feeEvents.at')
    if (at < arrival) {
      throw new DomainError('fee-before-arrival', `${fee.label} is dated before the vehicle arrived.`, 'feeEvents')
    }
    if (at <= end) counts.set(fee.code, (counts.get(fee.code) ?? 0) + 1)
  }
  const owed: [Fee, number][] = []
  for (const fee of ruleSet.fees) {
    const quantity = fee.charged === 'once-per-stay' ? 1 : (counts.get(fee.code) ?? 0)
    if (quantity > 0) owed.push([fee, quantity])
  }
  return owed
}
