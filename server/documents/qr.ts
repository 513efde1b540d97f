import QRCode from 'qrcode'
import type { Sheet } from './sheet'

/** A scanner needs four modules of blank margin round the symbol (ISO/IEC 18004); callers leave it. */
export const QUIET_MODULES = 4

const symbol = (data: string) => QRCode.create(data, { errorCorrectionLevel: 'M' }).modules

/** How many modules wide the symbol for `data` is, to size its quiet zone before drawing it. */
export const qrModules = (data: string) => symbol(data).size

/**
 * Draws a QR code as vector squares with its lower-left corner at (x, y), `size` points wide; error
 * correction M (15 %) survives a scuffed label. Returns the module count, for the quiet zone.
 */
export function drawQr(sheet: Sheet, data: string, x: number, y: number, size: number): number {
  const modules = symbol(data)
  const n = modules.size
  // Every run of dark modules in a row is a rectangle of one path, in module units, filled once: a
  // renderer leaves no hairline seams between rows as it may between separate rectangles, which
  // can keep a scanner from finding the symbol.
  let path = ''
  for (let row = 0; row < n; row++) {
    for (let col = 0; col < n; ) {
      if (!modules.get(row, col)) {
        col++
        continue
      }
      let run = 1
      while (col + run < n && modules.get(row, col + run)) run++
      path += `M${col} ${row}h${run}v1h${-run}Z`
      col += run
    }
  }
  sheet.page.drawSvgPath(path, { x, y: y + size, scale: size / n, color: sheet.colour('ink') })
  return n
}

/** A QR code at the cursor with the link a person can type printed beside it. */
export function qrWithLink(sheet: Sheet, url: string, label: string, shortLink: string, size = 72) {
  const quiet = (size / qrModules(url)) * QUIET_MODULES
  sheet.ensure(size + quiet)
  const top = sheet.y
  drawQr(sheet, url, sheet.left, top - size, size)
  const x = sheet.left + size + 12
  sheet.text(label, x, top - 14, { size: 9, colour: 'muted' })
  sheet.text(shortLink, x, top - 30, { size: 12, font: 'medium', colour: 'steel' })
  sheet.y = top - size - quiet
}
