import { dinero, halfUp, multiply, toSnapshot, transformScale } from 'dinero.js'
import { USD } from 'dinero.js/currencies'
import { DomainError } from '../errors'

/** Money is a whole number of US cents everywhere in Holdfast; floats never hold money. */
export type Cents = number

export function assertCents(value: number, field: string): Cents {
  if (!Number.isSafeInteger(value) || value < 0) {
    throw new DomainError('invalid-amount', `${field} must be a whole, non-negative number of cents.`, field)
  }
  return value
}

/**
 * cents × (amount / 10^scale), rounded half-up to the cent by dinero.js. Every rounded amount
 * in a bill goes through here, so one rounding rule holds everywhere: half-up, line by line.
 */
export function multiplyRounded(cents: Cents, factor: { amount: number; scale: number }): Cents {
  const scaled = multiply(dinero({ amount: cents, currency: USD }), factor)
  return toSnapshot(transformScale(scaled, USD.exponent, halfUp)).amount
}

/** Rates are stored as percentages with at most four decimals (7.25, 8.875, 0.0625). */
function percentFactor(percent: number): { amount: number; scale: number } {
  return { amount: Math.round(percent * 10_000), scale: 6 }
}

/**
 * Tax on one line, rounded half-up to the cent. Holdfast taxes each line on its own and the
 * bill's tax is the sum of the line taxes — so the printed lines always add up to the printed
 * total; a jurisdiction that rounds once per invoice may differ by a cent on a long bill.
 */
export function taxOnLine(amount: Cents, ratePercent: number): Cents {
  return ratePercent === 0 ? 0 : multiplyRounded(amount, percentFactor(ratePercent))
}

/** quantity × unit price, refused if it could no longer be represented exactly. */
export function times(unit: Cents, quantity: number, field: string): Cents {
  return assertCents(unit * quantity, field)
}

export function sumCents(amounts: readonly Cents[]): Cents {
  let total = 0
  for (const amount of amounts) total += amount
  return total
}

/**
 * "$1,234.56", in integer arithmetic: clock lists format a value for every vehicle, and Intl
 * is slow at that; the tests hold this to Intl's en-US currency format.
 */
export function formatCents(cents: Cents): string {
  const sign = cents < 0 ? '-' : ''
  const whole = Math.abs(cents)
  let dollars = String(Math.floor(whole / 100))
  for (let comma = dollars.length - 3; comma > 0; comma -= 3) dollars = `${dollars.slice(0, comma)},${dollars.slice(comma)}`
  const rest = whole % 100
  return `${sign}$${dollars}.${rest < 10 ? '0' : ''}${rest}`
}
