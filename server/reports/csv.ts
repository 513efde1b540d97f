import { Readable } from 'node:stream'

/**
 * One CSV cell, safe to open in a spreadsheet. A cell beginning with = + - @, a tab or a carriage
 * return gets a leading apostrophe so no spreadsheet reads it as a formula (OWASP, "CSV Injection":
 * https://owasp.org/www-community/attacks/CSV_Injection); then, as RFC 4180 §2 asks, a cell holding a
 * comma, a double quote or a line break is quoted and its double quotes doubled.
 */
export function csvCell(value: string | number | null | undefined): string {
  if (value === null || value === undefined) return ''
  let s = String(value)
  if (/^[=+\-@\t\r]/.test(s)) s = `'${s}`
  return /[",\r\n]/.test(s) ? `"${s.replaceAll('"', '""')}"` : s
}

export const csvLine = (cells: readonly (string | number | null | undefined)[]) => `${cells.map(csvCell).join(',')}\r\n`

/** Integer cents as plain dollars for a spreadsheet ("1234.50"): no symbol, no thousands separator. */
export function csvDollars(cents: number): string {
  const whole = Math.abs(cents)
  const rest = whole % 100
  return `${cents < 0 ? '-' : ''}${Math.floor(whole / 100)}.${rest < 10 ? '0' : ''}${rest}`
}

/**
 * A CSV body written as it is read: `lines` yields one line at a time and the stream asks for the next
 * only when the response has taken the last (backpressure), so a long list never sits whole in memory
 * as text. Lines are grouped into chunks of about 64 KB to keep the writes few.
 */
export function csvStream(lines: Iterable<string> | AsyncIterable<string>): Readable {
  async function* chunks() {
    let chunk = ''
    for await (const line of lines) {
      chunk += line
      if (chunk.length >= 65_536) {
        yield chunk
        chunk = ''
      }
    }
    if (chunk) yield chunk
  }
  return Readable.from(chunks())
}
