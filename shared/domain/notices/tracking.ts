const GS = String.fromCharCode(29)

/**
 * The tracking number in a scanned mail label. A USPS Intelligent Mail package barcode (GS1-128) carries
 * "420" and the destination ZIP (5 or 9 digits) before the tracking number, which starts with 9; the
 * printed number is that part (common trade practice, read from the label's layout; no published decoder
 * is followed here). Anything else readable as 10–40 letters and digits is taken as it is; else null.
 */
export function trackingFromBarcode(raw: string): string | null {
  // The GS1 group separator and spaces a scanner may pass through.
  const text = raw.split(GS).join('').replace(/\s/g, '').toUpperCase()
  if (/^420\d+$/.test(text)) {
    for (const zip of [5, 9]) {
      const rest = text.slice(3 + zip)
      if (/^9\d{19,33}$/.test(rest)) return rest
    }
  }
  return /^[A-Z0-9]{10,40}$/.test(text) ? text : null
}
