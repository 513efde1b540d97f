import type { TimelineStep } from '../../schemas/rule-sets'
import { formatCents } from '../billing/money'
import type { ClockNeed } from './clock-events'

export type ClockVehicle = { modelYear?: number | null; valueCents?: number | null }

export type Branch =
  | { applies: true; why?: string }
  | { applies: false; why: string }
  | { applies: 'unknown'; why: string; needs: ClockNeed }

type Range = { over?: number | undefined; atMost?: number | undefined }

/** A step's branch condition in one fixed shape, its band texts written once per rule set. */
type Condition = {
  value: boolean
  valueOver: number
  valueAtMost: number
  valueBand: string
  age: boolean
  ageOver: number
  ageAtMost: number
  ageBand: string
}

const conditions = new WeakMap<TimelineStep, Condition | null>()

function describe(range: Range | undefined, show: (n: number) => string): string {
  if (!range) return ''
  const parts: string[] = []
  if (range.over !== undefined) parts.push(`over ${show(range.over)}`)
  if (range.atMost !== undefined) parts.push(`at most ${show(range.atMost)}`)
  return parts.join(' and ')
}

const years = (n: number) => `${n} ${n === 1 ? 'year' : 'years'}`

function conditionOf(step: TimelineStep): Condition | null {
  let found = conditions.get(step)
  if (found === undefined) {
    const value = step.when?.valueCents
    const age = step.when?.ageYears
    found =
      value || age
        ? {
            value: value !== undefined,
            valueOver: value?.over ?? Number.NEGATIVE_INFINITY,
            valueAtMost: value?.atMost ?? Number.POSITIVE_INFINITY,
            valueBand: describe(value, formatCents),
            age: age !== undefined,
            ageOver: age?.over ?? Number.NEGATIVE_INFINITY,
            ageAtMost: age?.atMost ?? Number.POSITIVE_INFINITY,
            ageBand: describe(age, years),
          }
        : null
    conditions.set(step, found)
  }
  return found
}

const ALWAYS: Branch = { applies: true }

/**
 * Whether a step's branch (a value band, an age band) fits this vehicle, and why, in words.
 * Age is the calendar year the clock starts in minus the model year: the reading we use of
 * "more than 3 years old" until a statute's own definition says otherwise.
 */
export function branchChooser(vehicle: ClockVehicle): (step: TimelineStep, startYear: number) => Branch {
  let valuedText: string | undefined
  const valued = () => (valuedText ??= `Valued ${formatCents(vehicle.valueCents ?? 0)}`)
  return (step, startYear) => {
    const condition = conditionOf(step)
    return condition ? choose(condition, vehicle, valued, startYear) : ALWAYS
  }
}

function choose(c: Condition, vehicle: ClockVehicle, valued: () => string, startYear: number): Branch {
  let why = ''
  if (c.value) {
    const value = vehicle.valueCents
    if (value == null) {
      return { applies: 'unknown', needs: 'value', why: `Enter the value to see this deadline: it applies only to vehicles valued ${c.valueBand}.` }
    }
    if (!(value > c.valueOver && value <= c.valueAtMost)) {
      return { applies: false, why: `${valued()}; this applies only to vehicles valued ${c.valueBand}.` }
    }
    why = `${valued()}: ${c.valueBand}.`
  }
  if (c.age) {
    if (vehicle.modelYear == null) {
      return { applies: 'unknown', needs: 'model-year', why: `Enter the model year to see this deadline: it applies only to vehicles ${c.ageBand} old.` }
    }
    const age = startYear - vehicle.modelYear
    const aged = `Model year ${vehicle.modelYear}, ${years(age)} old in ${startYear}`
    if (!(age > c.ageOver && age <= c.ageAtMost)) {
      return { applies: false, why: `${aged}; this applies only to vehicles ${c.ageBand} old.` }
    }
    why = why === '' ? `${aged}: ${c.ageBand}.` : `${why} ${aged}: ${c.ageBand}.`
  }
  return { applies: true, why }
}
