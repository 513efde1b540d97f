/**
 * "$1,276.55" typed on a phone → 127655 cents, read as text so no float decides a cent. Anything
 * that is not a dollar figure comes back as NaN, and three decimals as a fraction of a cent, so
 * the shared schema refuses it with its own message beside the field.
 */
export function dollarsToCents(text: string): number {
  const clean = text.replace(/[$,\s]/g, '')
  const m = /^(-?)(\d*)(?:\.(\d*))?$/.exec(clean)
  if (!m || (m[2] === '' && !m[3])) return Number.NaN
  const [, sign, whole, fraction = ''] = m
  const cents = Number(whole || '0') * 100 + Number(fraction.slice(0, 2).padEnd(2, '0'))
  const rest = fraction.length > 2 ? Number(`0.${fraction.slice(2)}`) : 0
  return (sign ? -1 : 1) * (cents + rest)
}

/** 127655 → "1276.55", for putting a saved figure back in a field. */
export const centsToDollars = (cents: number) => `${Math.floor(cents / 100)}.${String(cents % 100).padStart(2, '0')}`

/** "1.5" → 1.5; an empty field is NaN so the schema asks for a figure. */
export const decimalField = (text: string) => (text.trim() === '' ? Number.NaN : Number(text.replace(',', '.')))
