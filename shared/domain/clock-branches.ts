import type { TimelineStep } from '../schemas/rule-sets'
import { formatCents } from './money'

export type ClockVehicle = { modelYear?: number | null; valueCents?: number | null }

export type Branch =
  | { applies: true; why?: string }
  | { applies: false; why: string }
  | { applies: 'unknown'; why: string }

type Range = { over?: number | undefined; atMost?: number | undefined }

function inRange(value: number, range: Range): boolean {
  return (range.over === undefined || value > range.over) && (range.atMost === undefined || value <= range.atMost)
}

const bandTexts = new WeakMap<Range, string>()

/** "over $500 and at most $4,000" — worked out once per rule set value, not once per vehicle. */
function describe(range: Range, show: (n: number) => string): string {
  let text = bandTexts.get(range)
  if (text === undefined) {
    const parts: string[] = []
    if (range.over !== undefined) parts.push(`over ${show(range.over)}`)
    if (range.atMost !== undefined) parts.push(`at most ${show(range.atMost)}`)
    text = parts.join(' and ')
    bandTexts.set(range, text)
  }
  return text
}

const years = (n: number) => `${n} ${n === 1 ? 'year' : 'years'}`

/**
 * Whether a step's branch (a value band, an age band) fits this vehicle, and why, in words.
 * Age is the calendar year the clock starts in minus the model year: the reading we use of
 * "more than 3 years old" until a statute's own definition says otherwise.
 */
export function branchChooser(vehicle: ClockVehicle): (step: TimelineStep, startYear: number) => Branch {
  let valuedText: string | undefined
  const valued = () => (valuedText ??= `Valued ${formatCents(vehicle.valueCents ?? 0)}`)
  return (step, startYear) => chooseBranch(step, vehicle, valued, startYear)
}

function chooseBranch(step: TimelineStep, vehicle: ClockVehicle, valued: () => string, startYear: number): Branch {
  const when = step.when
  if (!when) return { applies: true }
  const reasons: string[] = []
  if (when.valueCents) {
    const band = describe(when.valueCents, formatCents)
    if (vehicle.valueCents == null) {
      return { applies: 'unknown', why: `Enter the vehicle's value: this applies only to vehicles valued ${band}.` }
    }
    if (!inRange(vehicle.valueCents, when.valueCents)) {
      return { applies: false, why: `${valued()}; this applies only to vehicles valued ${band}.` }
    }
    reasons.push(`${valued()}: ${band}.`)
  }
  if (when.ageYears) {
    const band = describe(when.ageYears, years)
    if (vehicle.modelYear == null) {
      return { applies: 'unknown', why: `Enter the model year: this applies only to vehicles ${band} old.` }
    }
    const age = startYear - vehicle.modelYear
    const aged = `Model year ${vehicle.modelYear}, ${years(age)} old in ${startYear}`
    if (!inRange(age, when.ageYears)) {
      return { applies: false, why: `${aged}; this applies only to vehicles ${band} old.` }
    }
    reasons.push(`${aged}: ${band}.`)
  }
  return { applies: true, why: reasons.join(' ') }
}
