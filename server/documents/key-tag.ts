import { drawQr, qrModules, QUIET_MODULES } from './qr'
import { INCH, Sheet } from './sheet'
import type { Language } from './words'

export interface KeyTagVehicle {
  stockNumber: string
  year: number | null
  make: string | null
  model: string | null
  colour: string | null
  plate: string | null
  plateState: string | null
}

const WORDS = {
  en: { title: 'Stock label', colour: 'Colour', plate: 'Plate', unknown: 'not recorded', scan: 'Scan, or search', at: 'at' },
  es: { title: 'Etiqueta de inventario', colour: 'Color', plate: 'Placa', unknown: 'sin registrar', scan: 'Escanee, o busque', at: 'en' },
} satisfies Record<Language, Record<string, string>>

/** 4 × 2 in, the common thermal label and key-tag stock (trade practice, not a standard). */
export const KEY_TAG_SIZE = { width: 4 * INCH, height: 2 * INCH }

/**
 * The stock label / key tag printed at intake (issue 11): stock number, vehicle, colour and plate on the
 * left, a QR code on the right that opens the vehicle's page in Holdfast.
 */
export async function keyTag(vehicle: KeyTagVehicle, yardName: string, vehicleUrl: string, language: Language): Promise<Uint8Array> {
  const w = WORDS[language]
  const margin = 0.125 * INCH
  const sheet = await Sheet.create({
    ...KEY_TAG_SIZE,
    margin: { top: margin, right: margin, bottom: margin, left: margin },
    title: `${w.title} ${vehicle.stockNumber}`,
    language,
    pageNumbers: false,
  })
  const { height } = KEY_TAG_SIZE

  // The QR fills the right-hand side, with its full quiet zone of blank label to the edges.
  const qrSize = 1.3 * INCH
  const quiet = (qrSize / qrModules(vehicleUrl)) * QUIET_MODULES
  const qrX = KEY_TAG_SIZE.width - quiet - qrSize
  drawQr(sheet, vehicleUrl, qrX, height - quiet - qrSize, qrSize)
  const textRight = qrX - quiet
  const textWidth = textRight - sheet.left
  const host = new URL(vehicleUrl).host
  // Two lines under the QR, never cut: the type shrinks until both fit its width.
  const caption = [`${w.scan} ${vehicle.stockNumber}`, `${w.at} ${host}`]
  let captionSize = 6.5
  while (captionSize > 4.5 && caption.some((line) => sheet.width(line, { size: captionSize }) > qrSize + quiet)) captionSize -= 0.25
  caption.forEach((line, i) => sheet.text(line, qrX, margin + 8 - i * (captionSize + 1.5), { size: captionSize, colour: 'muted' }))

  // The stock number as large as the width allows: it is read across a yard.
  let size = 24
  while (size > 12 && sheet.width(vehicle.stockNumber, { size, font: 'bold' }) > textWidth) size--
  let y = height - margin - size
  sheet.text(vehicle.stockNumber, sheet.left, y, { size, font: 'bold' })
  sheet.page.drawRectangle({ x: sheet.left, y: y - 6, width: Math.min(textWidth, 64), height: 2.5, color: sheet.colour('amber') })

  y -= 22
  const ymm = [vehicle.year, vehicle.make, vehicle.model].filter(Boolean).join(' ') || w.unknown
  for (const line of sheet.wrap(ymm, textWidth, { size: 12, font: 'medium' }).slice(0, 2)) {
    sheet.text(line, sheet.left, y, { size: 12, font: 'medium' })
    y -= 14
  }
  y -= 4
  const plate = vehicle.plate ? [vehicle.plate, vehicle.plateState].filter(Boolean).join(' · ') : w.unknown
  for (const [label, value] of [[w.colour, vehicle.colour ?? w.unknown], [w.plate, plate]] as const) {
    sheet.text(label, sheet.left, y, { size: 8, colour: 'muted', font: 'medium' })
    sheet.text(sheet.wrap(value, textWidth - 42, { size: 10 })[0]!, sheet.left + 42, y, { size: 10 })
    y -= 13
  }
  sheet.text(yardName, sheet.left, margin + 1, { size: 7, colour: 'muted' })
  return sheet.finish()
}
