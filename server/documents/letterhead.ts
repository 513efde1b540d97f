import type { Sheet } from './sheet'

export interface YardHeading {
  name: string
  address: string
  phone: string | null
}

// public/holdfast-mark.svg, drawn with the same paths (a 64-unit square): a tow hook closing over a chain link.
const MARK = {
  tile: 'M13 0 H51 A13 13 0 0 1 64 13 V51 A13 13 0 0 1 51 64 H13 A13 13 0 0 1 0 51 V13 A13 13 0 0 1 13 0 Z',
  link: 'M23 45 A7 7 0 0 1 37 45 V53 A7 7 0 0 1 23 53 Z',
  shank: 'M38 16 V30 a10 10 0 0 1 -20 0 v-4',
  barb: 'M14.5 27 l3.5 -6 l3.5 6 z',
}

/** The mark, `size` points square, its top-left corner at (x, top). */
export function drawMark(sheet: Sheet, x: number, top: number, size: number) {
  const scale = size / 64
  const at = { x, y: top, scale }
  sheet.page.drawSvgPath(MARK.tile, { ...at, color: sheet.colour('ink') })
  sheet.page.drawSvgPath(MARK.link, { ...at, borderColor: sheet.colour('paper'), borderWidth: 4.5 * scale })
  sheet.page.drawCircle({ x: x + 38 * scale, y: top - 11 * scale, size: 5 * scale, borderColor: sheet.colour('amber'), borderWidth: 4.5 * scale })
  sheet.page.drawSvgPath(MARK.shank, { ...at, borderColor: sheet.colour('amber'), borderWidth: 6 * scale, borderLineCap: sheet.lib.LineCapStyle.Round })
  sheet.page.drawSvgPath(MARK.barb, { ...at, color: sheet.colour('amber') })
}

/** The yard's heading at the top of a letter: mark, name, address and phone, the document's title on the right. */
export function letterhead(sheet: Sheet, yard: YardHeading, title: string) {
  const top = sheet.y
  const markSize = 40
  drawMark(sheet, sheet.left, top, markSize)
  const x = sheet.left + markSize + 12
  sheet.text(yard.name, x, top - 16, { size: 16, font: 'bold' })
  sheet.text(yard.address, x, top - 29, { size: 9, colour: 'muted' })
  if (yard.phone) sheet.text(`${sheet.words.phone} ${yard.phone}`, x, top - 40, { size: 9, colour: 'muted' })
  const titleSize = 12
  sheet.text(title.toUpperCase(), sheet.right - sheet.width(title.toUpperCase(), { size: titleSize, font: 'medium' }), top - 16, { size: titleSize, font: 'medium', colour: 'steel' })
  sheet.y = top - markSize - 10
  sheet.rule('steel', 1.5)
  sheet.space(14)
}
