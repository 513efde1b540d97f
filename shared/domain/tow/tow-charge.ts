import { haversineMiles, type LatLng } from './distance'
import { DomainError } from '../errors'
import { assertCents, type Cents, multiplyRounded, sumCents, times } from '../billing/money'

export type TowRates = {
  hookUpCents: Cents
  perMileCents: Cents
  /** Miles the hook-up already pays for. */
  includedMiles?: number
  /** Winching is billed per unit of work (say, each 15 minutes): the yard picks the unit. */
  winchingCentsPerUnit?: Cents
  dolliesCents?: Cents
  afterHoursCents?: Cents
}

export type TowExtras = {
  /** Road miles from the driver or the truck: when given they win over the great circle. */
  roadMiles?: number | null
  winchingUnits?: number
  dollies?: boolean
  afterHours?: boolean
}

export type TowLine = {
  code: 'hook-up' | 'mileage' | 'winching' | 'dollies' | 'after-hours'
  label: string
  quantity: number
  unitCents: Cents
  amountCents: Cents
  reason: string
  /** The numbers the reason quotes, so a reader's language can say it again (shared/messages tow.lines). */
  params?: Record<string, string | number>
}

export type TowCharge = {
  miles: number
  milesFrom: 'road' | 'great-circle'
  billableMiles: number
  lines: TowLine[]
  totalCents: Cents
}

function nonNegative(value: number, field: string): number {
  if (!Number.isFinite(value) || value < 0) {
    throw new DomainError('invalid-amount', `${field} must be zero or more.`, field)
  }
  return value
}

/** Miles up to the next tenth: a fraction of a tenth is a tenth (the epsilon absorbs 0.1·3 ≠ 0.3). */
const tenthsUp = (miles: number) => Math.max(0, Math.ceil(miles * 10 - 1e-9))

/** Hook-up + mileage + add-ons, in whole cents; mileage rounds half-up to the cent (money.ts). */
export function towCharge(pickup: LatLng, yard: LatLng, rates: TowRates, extras: TowExtras = {}): TowCharge {
  const centFields = ['hookUpCents', 'perMileCents', 'winchingCentsPerUnit', 'dolliesCents', 'afterHoursCents'] as const
  for (const field of centFields) assertCents(rates[field] ?? 0, field)
  const road = extras.roadMiles == null ? undefined : nonNegative(extras.roadMiles, 'roadMiles')
  const miles = road ?? haversineMiles(pickup, yard)
  const included = nonNegative(rates.includedMiles ?? 0, 'includedMiles')
  const billableTenths = tenthsUp(miles - included)
  const shown = (tenths: number) => (tenths / 10).toFixed(1)

  const lines: TowLine[] = [
    { code: 'hook-up', label: 'Hook-up', quantity: 1, unitCents: rates.hookUpCents, amountCents: rates.hookUpCents, reason: 'Charged once per tow.' },
    {
      code: 'mileage',
      label: 'Mileage',
      quantity: billableTenths / 10,
      unitCents: rates.perMileCents,
      amountCents: multiplyRounded(rates.perMileCents, { amount: billableTenths, scale: 1 }),
      params: { from: road === undefined ? 'great-circle' : 'road', miles: road === undefined ? miles.toFixed(2) : shown(tenthsUp(road)), included, billed: shown(billableTenths) },
      reason:
        `${road === undefined ? `${miles.toFixed(2)} great-circle miles from the pickup point to the yard` : `${shown(tenthsUp(road))} road miles as entered`}` +
        (included > 0 ? `, less ${included} included with the hook-up` : '') +
        `: ${shown(billableTenths)} miles billed, rounded up to the tenth.`,
    },
  ]
  const units = extras.winchingUnits ?? 0
  if (!Number.isInteger(units) || units < 0) {
    throw new DomainError('invalid-amount', 'winchingUnits must be a whole number of units.', 'winchingUnits')
  }
  if (units > 0) {
    const unit = rates.winchingCentsPerUnit ?? 0
    lines.push({ code: 'winching', label: 'Winching', quantity: units, unitCents: unit, amountCents: times(unit, units, 'winching'), params: { n: units }, reason: `${units} unit${units === 1 ? '' : 's'} of winching.` })
  }
  if (extras.dollies) {
    const unit = rates.dolliesCents ?? 0
    lines.push({ code: 'dollies', label: 'Dollies', quantity: 1, unitCents: unit, amountCents: unit, reason: 'Dollies were used.' })
  }
  if (extras.afterHours) {
    const unit = rates.afterHoursCents ?? 0
    lines.push({ code: 'after-hours', label: 'After hours', quantity: 1, unitCents: unit, amountCents: unit, reason: 'The tow was outside business hours.' })
  }
  return {
    miles,
    milesFrom: road === undefined ? 'great-circle' : 'road',
    billableMiles: billableTenths / 10,
    lines,
    totalCents: sumCents(lines.map((l) => l.amountCents)),
  }
}
