import type { RuleSet } from '../../schemas/rule-sets'
import { type BillLine, type FeeEvent, feeLines, storageLine } from './bill-lines'
import { isoInstant } from '../time/calendar-dates'
import { countStorageDays, type DayCount } from './day-count'
import { DomainError } from '../errors'
import { assertTimeZone, type Instant, MS_PER_DAY, toEpochMs } from '../time/local-time'
import type { Cents } from './money'

export type { BillLine, FeeEvent } from './bill-lines'

export type StayInput = {
  arrivedAt: Instant
  releasedAt?: Instant | null
  vehicleClass: string
  feeEvents?: readonly FeeEvent[]
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
  /** The same warnings as data, for the reader's language (`warnings` stays the English). */
  sampleWarnings: SampleWarning[]
  caution: string
}

/**
 * A sample amount the yard has not set yet: a class's storage rate, a fee (each with the rule set's
 * Spanish name where it has one), or the tax rate. The screens word it from the catalogs.
 */
export type SampleWarning =
  | { code: 'sample-storage' | 'sample-fee'; label: string; es?: { label?: string } }
  | { code: 'sample-tax' }

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
  const warnings: string[] = []
  const lines = [storageLine(dayCount, vehicleClass, ruleSet.storage, rate, warnings)]
  feeLines(stay.feeEvents ?? [], ruleSet, arrival, end, lines, warnings)

  let subtotalCents = 0
  let taxCents = 0
  for (const line of lines) {
    subtotalCents += line.amountCents
    taxCents += line.taxCents
  }
  if (ruleSet.tax.placeholder && taxCents > 0) warnings.push('The tax rate is a sample — set your rate.')
  const sampleWarnings: SampleWarning[] = lines
    .filter((l) => l.placeholder)
    .map((l) =>
      l.kind === 'storage'
        ? { code: 'sample-storage', label: vehicleClass.label, ...(vehicleClass.es?.label ? { es: { label: vehicleClass.es.label } } : {}) }
        : { code: 'sample-fee', label: l.label, ...(l.es?.label ? { es: { label: l.es.label } } : {}) },
    )
  if (ruleSet.tax.placeholder && taxCents > 0) sampleWarnings.push({ code: 'sample-tax' })
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
    sampleWarnings,
    caution: ruleSet.caution,
  }
}
