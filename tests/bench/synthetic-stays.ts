import type { ClockEvent, ClockVehicle } from '@shared/domain/clocks'
import type { StayInput } from '@shared/domain/billing'
import type { RuleSet } from '@shared/schemas/rule-sets'

export type SyntheticVehicle = {
  ruleSet: RuleSet
  stay: StayInput & { arrivedAt: number; releasedAt: number | null }
  vehicle: ClockVehicle
  events: ClockEvent[]
}

const HOUR = 3_600_000
const DAY = 24 * HOUR

/** mulberry32: a small seeded generator, so every run bills the same invented yard. */
function random(seed: number): () => number {
  let a = seed >>> 0
  return () => {
    a = (a + 0x6d2b79f5) >>> 0
    let t = a
    t = Math.imul(t ^ (t >>> 15), t | 1)
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61)
    return ((t ^ (t >>> 14)) >>> 0) / 4_294_967_296
  }
}

/**
 * Invented vehicles for the benchmark: stays from minutes to two years ending by `asOf`,
 * spread over the shipped rule sets, with fee events, notices and sale dates.
 */
export function syntheticVehicles(count: number, ruleSets: readonly RuleSet[], asOf: number, seed = 20_260_301): SyntheticVehicle[] {
  const next = random(seed)
  const pick = <T>(list: readonly T[]) => list[Math.floor(next() * list.length)] as T
  const vehicles: SyntheticVehicle[] = []
  for (let i = 0; i < count; i++) {
    const ruleSet = pick(ruleSets)
    // A quarter are short stays (the minimum-stay rules); the rest anything up to two years.
    const length = next() < 0.25 ? Math.floor(next() * 72 * HOUR) : Math.floor(next() * 730 * DAY)
    const arrivedAt = asOf - Math.floor(next() * (730 * DAY - length)) - length
    const released = next() < 0.7
    const end = arrivedAt + length
    const perEvent = ruleSet.fees.filter((f) => f.charged === 'per-event')
    const feeEvents = Array.from({ length: Math.floor(next() * 3) }, () => ({
      fee: pick(perEvent).code,
      at: arrivedAt + Math.floor(next() * (end - arrivedAt)),
    }))
    const events: ClockEvent[] = [
      { kind: 'stored', at: arrivedAt },
      { kind: 'lien-arose', at: arrivedAt },
    ]
    if (next() < 0.6) events.push({ kind: 'owner-notice-mailed', at: arrivedAt + Math.floor(next() * 14 * DAY) })
    if (next() < 0.5) events.push({ kind: 'lien-notice-mailed', at: arrivedAt + Math.floor(next() * 30 * DAY) })
    if (next() < 0.4) events.push({ kind: 'sale-scheduled', at: arrivedAt + Math.floor((40 + next() * 60) * DAY) })
    vehicles.push({
      ruleSet,
      stay: {
        arrivedAt,
        releasedAt: released ? end : null,
        vehicleClass: pick(ruleSet.vehicleClasses).code,
        feeEvents,
      },
      vehicle: { modelYear: 1995 + Math.floor(next() * 32), valueCents: 20_000 + Math.floor(next() * 2_000_000) },
      events,
    })
  }
  return vehicles
}
