import type { RuleSet, Source, StorageRules, VehicleClass } from '../../schemas/rule-sets'
import type { DayCount } from './day-count'
import { DomainError } from '../errors'
import { type Instant, toEpochMs } from '../time/local-time'
import { type Cents, taxOnLine, times } from './money'

export type FeeEvent = { fee: string; at: Instant }

export type BillLine = {
  kind: 'storage' | 'fee'
  code: string
  label: string
  /** A fee's name in Spanish, where the rule set has it. */
  es?: { label?: string }
  quantity: number
  unitCents: Cents
  amountCents: Cents
  taxCents: Cents
  reason: string
  source: Source
  /** The amount is a sample the yard has not set yet. */
  placeholder: boolean
}

// Texts that depend only on a class or a fee of a rule set are made once per rule set object.
const labels = new WeakMap<VehicleClass, string>()
const warningTexts = new WeakMap<object, string>()

function placeholderWarning(owner: object, label: string): string {
  let text = warningTexts.get(owner)
  if (text === undefined) warningTexts.set(owner, (text = `${label}: the amount is a sample — set your rate.`))
  return text
}

/** The storage line; a placeholder rate adds its warning to `warnings`. */
export function storageLine(
  dayCount: DayCount,
  vehicleClass: VehicleClass,
  rules: StorageRules,
  rate: number,
  warnings: string[],
): BillLine {
  let amountCents = times(vehicleClass.dailyRateCents, dayCount.days, 'storage')
  let reason = dayCount.steps.length === 1 ? (dayCount.steps[0]?.says as string) : dayCount.steps.map((s) => s.says).join(' ')
  const maxCents = rules.cap?.maxStorageCents
  if (maxCents !== undefined && amountCents > maxCents) {
    amountCents = maxCents
    reason += ' Storage is capped at the rule set’s maximum charge.'
  }
  let label = labels.get(vehicleClass)
  if (label === undefined) labels.set(vehicleClass, (label = `${vehicleClass.label} storage`))
  if (vehicleClass.placeholder) warnings.push(placeholderWarning(vehicleClass, label))
  return {
    kind: 'storage',
    code: 'storage',
    label,
    quantity: dayCount.days,
    unitCents: vehicleClass.dailyRateCents,
    amountCents,
    taxCents: rules.taxable ? taxOnLine(amountCents, rate) : 0,
    reason,
    source: vehicleClass.source,
    placeholder: vehicleClass.placeholder,
  }
}

/** Adds the one-off fees a stay owes up to `end` to `lines`, in the rule set's order. */
export function feeLines(
  events: readonly FeeEvent[],
  ruleSet: RuleSet,
  arrival: number,
  end: number,
  lines: BillLine[],
  warnings: string[],
): void {
  const fees = ruleSet.fees
  const counts = fees.map((fee): number => (fee.charged === 'once-per-stay' ? 1 : 0))
  for (const event of events) {
    const index = fees.findIndex((f) => f.code === event.fee)
    const fee = fees[index]
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
    if (at <= end) counts[index] = (counts[index] as number) + 1
  }
  fees.forEach((fee, index) => {
    const quantity = counts[index] as number
    if (quantity === 0) return
    if (fee.placeholder) warnings.push(placeholderWarning(fee, fee.label))
    const amountCents = times(fee.amountCents, quantity, fee.code)
    lines.push({
      kind: 'fee',
      code: fee.code,
      label: fee.label,
      ...(fee.es?.label ? { es: { label: fee.es.label } } : {}),
      quantity,
      unitCents: fee.amountCents,
      amountCents,
      taxCents: fee.taxable ? taxOnLine(amountCents, ruleSet.tax.ratePercent) : 0,
      reason: fee.charged === 'once-per-stay' ? 'Charged once for the stay.' : `Charged each time: ${quantity} recorded.`,
      source: fee.source,
      placeholder: fee.placeholder,
    })
  })
}
