import { usFederalHolidays } from '../helpers/us-federal-holidays'
import type { RuleSet, TimelineStep } from '@shared/schemas/rule-sets'
import type { SyntheticVehicle } from './synthetic-stays'

/**
 * The baseline the benchmark measures against: the same bill totals and due dates, worked out
 * the obvious way — walking the stay day by day, asking Intl for each local date, and walking
 * each legal clock one day at a time. Written apart from shared/domain so that agreement
 * between the two means something.
 */

const HOUR = 3_600_000
const DAY = 24 * HOUR
const formatters = new Map<string, Intl.DateTimeFormat>()

function localDate(zone: string, instant: number): string {
  let format = formatters.get(zone)
  if (!format) {
    format = new Intl.DateTimeFormat('en-CA', { timeZone: zone, year: 'numeric', month: '2-digit', day: '2-digit' })
    formatters.set(zone, format)
  }
  return format.format(instant)
}

/** Local dates touched from `first` to `last`, sampled every 12 h (no local day is that short). */
function calendarDaysWalked(zone: string, first: number, last: number): number {
  let count = 1
  let previous = localDate(zone, first)
  for (let t = first + 12 * HOUR; t <= last; t += 12 * HOUR) {
    const date = localDate(zone, t)
    if (date !== previous) {
      count++
      previous = date
    }
  }
  if (last > first && localDate(zone, last) !== previous) count++
  return count
}

function storageDays(ruleSet: RuleSet, arrival: number, end: number): number {
  const rules = ruleSet.storage
  const elapsed = end - arrival
  if (rules.noChargeUnder && elapsed < rules.noChargeUnder.hours * HOUR) return 0
  if (elapsed === 0) return 0
  const grace = (rules.grace?.hours ?? 0) * HOUR
  let days = 1
  if (rules.counting.method === 'calendar-day') days = calendarDaysWalked(ruleSet.timeZone, arrival, end - 1 - grace)
  else for (let t = arrival + DAY; t < end - grace; t += DAY) days++
  if (rules.oneDayIfReleasedWithin && elapsed <= rules.oneDayIfReleasedWithin.hours * HOUR) days = Math.min(days, 1)
  if (rules.cap?.maxDays !== undefined) days = Math.min(days, rules.cap.maxDays)
  return days
}

/** Half-up to the cent in integers: amount × rate%, the rate held in millionths. */
const tax = (amount: number, percent: number) => Math.floor((amount * Math.round(percent * 10_000) + 500_000) / 1_000_000)

export function naiveTotalCents({ ruleSet, stay }: SyntheticVehicle, asOf: number): number {
  const end = stay.releasedAt !== null && stay.releasedAt <= asOf ? stay.releasedAt : asOf
  const rate = ruleSet.vehicleClasses.find((c) => c.code === stay.vehicleClass)!.dailyRateCents
  let storage = storageDays(ruleSet, stay.arrivedAt, end) * rate
  if (ruleSet.storage.cap?.maxStorageCents !== undefined) storage = Math.min(storage, ruleSet.storage.cap.maxStorageCents)
  let total = storage + (ruleSet.storage.taxable ? tax(storage, ruleSet.tax.ratePercent) : 0)
  for (const fee of ruleSet.fees) {
    const count =
      fee.charged === 'once-per-stay' ? 1 : (stay.feeEvents ?? []).filter((e) => e.fee === fee.code && Number(e.at) <= end).length
    const amount = fee.amountCents * count
    total += amount + (fee.taxable ? tax(amount, ruleSet.tax.ratePercent) : 0)
  }
  return total
}

const holidayDates = new Set<string>()
for (let year = 2020; year <= 2032; year++) for (const h of usFederalHolidays(year)) holidayDates.add(h.date)

function shiftDate(date: string, days: number): string {
  const [y, m, d] = date.split('-').map(Number) as [number, number, number]
  return new Date(Date.UTC(y, m - 1, d + days)).toISOString().slice(0, 10)
}

function closed(date: string): boolean {
  const day = new Date(`${date}T00:00:00Z`).getUTCDay()
  return day === 0 || day === 6 || holidayDates.has(date)
}

function applies(step: TimelineStep, modelYear: number, valueCents: number, startYear: number): boolean {
  const inside = (value: number, band?: { over?: number | undefined; atMost?: number | undefined }) =>
    !band || ((band.over === undefined || value > band.over) && (band.atMost === undefined || value <= band.atMost))
  return inside(valueCents, step.when?.valueCents) && inside(startYear - modelYear, step.when?.ageYears)
}

/** "code:due date" for every step that applies, one day at a time. */
export function naiveDueDates({ ruleSet, vehicle, events }: SyntheticVehicle, asOf: number): string[] {
  const zone = ruleSet.timeZone
  const due: string[] = []
  for (const step of ruleSet.timeline) {
    const starts = events
      .filter((e) => e.kind === step.from && (e.kind === 'sale-scheduled' || Number(e.at) <= asOf))
      .map((e) => Number(e.at))
    const start = starts.length > 0 ? Math.max(...starts) : undefined
    const startDate = start === undefined ? undefined : localDate(zone, start)
    const year = Number((startDate ?? localDate(zone, asOf)).slice(0, 4))
    if (!applies(step, vehicle.modelYear!, vehicle.valueCents!, year)) continue
    if (startDate === undefined) {
      due.push(`${step.code}:-`)
      continue
    }
    const sign = step.direction === 'after' ? 1 : -1
    let date = startDate
    for (let left = step.days; left > 0; ) {
      date = shiftDate(date, sign)
      if (step.dayKind === 'calendar' || !closed(date)) left--
    }
    due.push(`${step.code}:${date}`)
  }
  return due
}
