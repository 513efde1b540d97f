import type { Disposition } from '@shared/domain/lifecycle'
import { letterhead, type YardHeading } from './letterhead'
import { drawQr, qrModules, QUIET_MODULES } from './qr'
import { RELEASE_WORDS, yardDateTime } from './release-words'
import { INCH, LETTER, Sheet } from './sheet'
import type { Language } from './words'

export interface GatePassData {
  yard: YardHeading & { timeZone: string }
  vehicle: { stockNumber: string; year: number | null; make: string | null; model: string | null; colour: string | null; plate: string | null; plateState: string | null }
  space: string | null
  claimantName: string | null
  disposition: Disposition
  /** The link in the QR: <public URL>/g/<token>. The token is in the QR and nowhere else. */
  link: string
  /** The short code, printed as XXXXX-XXXXX for typing. */
  code: string
  expiresAt: Date
}

/** The gate pass: a large QR the gate's phone scans, the typed code beneath it, and what leaves. */
export async function gatePass(d: GatePassData, language: Language): Promise<Uint8Array> {
  const w = RELEASE_WORDS[language]
  const margin = 0.6 * INCH
  const sheet = await Sheet.create({ ...LETTER, margin: { top: margin, right: margin, bottom: margin, left: margin }, title: `${w.passTitle} ${d.vehicle.stockNumber}`, language })
  letterhead(sheet, d.yard, w.passTitle)

  const size = 2.6 * INCH
  const quiet = (size / qrModules(d.link)) * QUIET_MODULES
  const top = sheet.y - quiet
  drawQr(sheet, d.link, sheet.left + quiet, top - size, size)
  const x = sheet.left + size + quiet * 2 + 16
  sheet.text(d.vehicle.stockNumber, x, top - 30, { size: 30, font: 'bold' })
  sheet.page.drawRectangle({ x, y: top - 40, width: 72, height: 3, color: sheet.colour('amber') })
  const rows: [string, string][] = [
    [w.vehicle, [d.vehicle.year, d.vehicle.make, d.vehicle.model].filter(Boolean).join(' ') || w.none],
    [w.colour, d.vehicle.colour ?? w.none],
    [w.plate, d.vehicle.plate ? [d.vehicle.plate, d.vehicle.plateState].filter(Boolean).join(' · ') : w.none],
    [w.space, d.space ?? w.none],
    [w.claimant, d.claimantName ?? w.none],
    [w.disposition, w.dispositions[d.disposition]],
  ]
  let y = top - 64
  for (const [label, value] of rows) {
    sheet.text(label, x, y, { size: 9, colour: 'muted', font: 'medium' })
    sheet.text(sheet.wrap(value, sheet.right - x - 70, { size: 11 })[0]!, x + 70, y, { size: 11 })
    y -= 17
  }
  sheet.y = top - size - quiet - 8
  sheet.text(w.code, sheet.left, sheet.y - 12, { size: 10, colour: 'muted', font: 'medium' })
  sheet.text(d.code, sheet.left + 60, sheet.y - 16, { size: 24, font: 'bold', colour: 'steel' })
  sheet.y -= 34
  sheet.labelValues([[w.validUntil, yardDateTime(d.expiresAt, d.yard.timeZone, language)]], { labelWidth: 60 })
  sheet.paragraph(w.scan, { size: 10 })
  sheet.caution()
  return sheet.finish()
}
