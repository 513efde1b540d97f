import { assertCents, type Cents, multiplyRounded, sumCents, times } from '../billing/money'

/**
 * Bounds every estimate input is checked against, on both sides and in the tables: past them a
 * figure is a slip of the thumb, not a price. 40 hours is a working week on one line.
 */
export const LIMITS = {
  maxQuantity: 99,
  maxUnitPriceCents: 5_000_000,
  maxLabourHours: 40,
  maxValueCents: 100_000_000,
  minLugTorqueFtLbf: 20,
  maxLugTorqueFtLbf: 400,
} as const

export interface EstimateLine {
  quantity: number
  unitPriceCents: Cents
  /** Labour in hundredths of an hour (1.5 h = 150), so no float holds an hour figure. */
  labourHundredths: number
  /** The yard's rate per hour when the line was written. */
  labourRateCents: Cents
}

export interface LineCents {
  partsCents: Cents
  labourCents: Cents
  totalCents: Cents
}

/**
 * One line in cents: parts = quantity × unit price (exact); labour = hours × rate, rounded half-up
 * to the cent on the line. The estimate is the sum of its lines, so the printed lines always add
 * up to the printed total.
 */
export function lineCents(line: EstimateLine): LineCents {
  assertCents(line.unitPriceCents, 'unitPriceCents')
  assertCents(line.labourRateCents, 'labourRateCents')
  const partsCents = times(line.unitPriceCents, line.quantity, 'unitPriceCents')
  const labourCents = multiplyRounded(line.labourRateCents, { amount: line.labourHundredths, scale: 2 })
  return { partsCents, labourCents, totalCents: partsCents + labourCents }
}

export function estimateTotals(lines: readonly EstimateLine[]): LineCents {
  const each = lines.map(lineCents)
  const partsCents = sumCents(each.map((l) => l.partsCents))
  const labourCents = sumCents(each.map((l) => l.labourCents))
  return { partsCents, labourCents, totalCents: partsCents + labourCents }
}

/** 1.5 → 150; undefined when the figure has more than two decimals (a quarter of an hour is 0.25). */
export function hoursToHundredths(hours: number): number | undefined {
  const hundredths = Math.round(hours * 100)
  return Math.abs(hours * 100 - hundredths) < 1e-6 ? hundredths : undefined
}

export const hundredthsToHours = (hundredths: number) => hundredths / 100
