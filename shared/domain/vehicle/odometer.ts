import { dayFromCivil, dayFromIsoDate } from '../time/calendar-dates'
import { DomainError } from '../errors'

/**
 * `exemptFrom`: when a disclosure is required only until an age exemption starts, the year it starts (1 January), its
 * clause, and the model-year band the clause covers (2010 or older, 2011 or newer).
 */
export type OdometerDecision = { required: boolean; clause: string; reason: string; exemptFrom?: { year: number; clause: string; band: 'older' | 'newer' } }

/** 49 CFR 580.17(a)(1): a vehicle rated heavier than this is exempt. */
export const ODOMETER_EXEMPT_ABOVE_GVWR_LB = 16_000

/**
 * Whether a transfer needs an odometer disclosure: 49 CFR 580.5 requires one unless an
 * exemption of 580.17(a) applies — as amended by 84 FR 65017, in force from 1 January 2021.
 * The amended rule gives the old answers for earlier transfers too (no model year 2011 or
 * newer vehicle was 10 years old before 2021), so one rule serves every transfer date.
 */
export function odometerDisclosure(
  modelYear: number,
  gvwrLb: number,
  selfPropelled: boolean,
  transferDate: string,
): OdometerDecision {
  if (!Number.isInteger(modelYear) || modelYear < 1900 || modelYear > 2200) {
    throw new DomainError('invalid-model-year', 'The model year must be a four-digit year.', 'modelYear')
  }
  if (!Number.isFinite(gvwrLb) || gvwrLb < 0) {
    throw new DomainError('invalid-amount', 'The GVWR must be a weight in pounds.', 'gvwrLb')
  }
  const transfer = dayFromIsoDate(transferDate, 'transferDate')
  if (gvwrLb > ODOMETER_EXEMPT_ABOVE_GVWR_LB) {
    return {
      required: false,
      clause: '49 CFR 580.17(a)(1)',
      reason: `Exempt: the GVWR of ${gvwrLb.toLocaleString('en-US')} lb is more than 16,000 lb.`,
    }
  }
  if (!selfPropelled) {
    return { required: false, clause: '49 CFR 580.17(a)(2)', reason: 'Exempt: the vehicle is not self-propelled.' }
  }
  const years = modelYear <= 2010 ? 10 : 20
  const clause = modelYear <= 2010 ? '49 CFR 580.17(a)(3)' : '49 CFR 580.17(a)(4)'
  const exemptFrom = dayFromCivil(modelYear + years, 1, 1)
  const band = modelYear <= 2010 ? 'model year 2010 or older' : 'model year 2011 or newer'
  if (transfer >= exemptFrom) {
    return {
      required: false,
      clause,
      reason: `Exempt: a ${band} vehicle transferred at least ${years} years after 1 January ${modelYear} (from 1 January ${modelYear + years}).`,
    }
  }
  return {
    required: true,
    clause: '49 CFR 580.5',
    reason: `Disclose the mileage: a ${band} vehicle is exempt only from 1 January ${modelYear + years} (${clause}).`,
    exemptFrom: { year: modelYear + years, clause, band: modelYear <= 2010 ? 'older' : 'newer' },
  }
}
