import type { IdType } from '@shared/schemas/releases'
import type { BuyerKind, Proceeds, TransferKind } from '@shared/schemas/transfers'
import type { OdometerDecision } from '@shared/domain/vehicle'
import { formatCents } from '@shared/domain/billing'
import { letterhead, type YardHeading } from './letterhead'
import { yardDateTime } from './release-words'
import { LETTER, Sheet } from './sheet'
import { TRANSFER_WORDS } from './transfer-words'
import type { Language } from './words'

export interface TransferPacketData {
  yard: YardHeading & { timeZone: string }
  vehicle: { stockNumber: string; vin: string | null; year: number | null; make: string | null; model: string | null; plate: string | null; plateState: string | null }
  transfer: {
    kind: TransferKind
    sellerName: string
    buyerKind: BuyerKind
    buyerName: string
    buyerAddress: string
    buyerIdType: IdType | null
    buyerIdNumber: string | null
    priceCents: number
    date: string
    odometer: number | null
    odometerUnreadable: boolean
  }
  odometer: OdometerDecision
  proceeds: Proceeds | null
  /** The seller's signature as captured on the counter's pad (PNG or JPEG bytes). */
  signature: { image: Uint8Array; signerName: string; signedAt: Date } | null
  printedAt: Date
}

const LABEL_WIDTH = 150
const isPng = (b: Uint8Array) => b[0] === 0x89 && b[1] === 0x50 && b[2] === 0x4e && b[3] === 0x47

function calendarDay(day: string, language: Language) {
  return new Intl.DateTimeFormat(language === 'es' ? 'es-US' : 'en-GB', { dateStyle: 'long', timeZone: 'UTC' }).format(new Date(`${day}T12:00:00Z`))
}

/**
 * The title-transfer packet (issue 11): the bill of sale (seller, buyer, price, date, VIN, year, make,
 * model), a lien sale's proceeds and how they were applied, the odometer disclosure statement when
 * 49 CFR 580.17 leaves the transfer under 580.5 (or why it is exempt), a checklist of what must be
 * brought and signed, signature lines, and the caution every legal document carries.
 */
export async function transferPacket(d: TransferPacketData, language: Language): Promise<Uint8Array> {
  const w = TRANSFER_WORDS[language]
  const t = d.transfer
  const margin = 0.6 * 72
  const sheet = await Sheet.create({ ...LETTER, margin: { top: margin, right: margin, bottom: margin, left: margin }, title: `${w.title} ${d.vehicle.stockNumber}`, language })
  letterhead(sheet, d.yard, w.title)
  const number = (n: number) => n.toLocaleString(language === 'es' ? 'es-US' : 'en-US')

  sheet.heading(w.billOfSale, 2)
  sheet.paragraph(w.saleStatement(t.kind), { size: 9.5 })
  sheet.labelValues(
    [
      [w.kind, w.kinds[t.kind]],
      [w.seller, t.sellerName],
      [w.buyer, `${t.buyerName} · ${w.buyerKinds[t.buyerKind]}`],
      [w.buyerAddress, t.buyerAddress],
      ...(t.buyerIdType && t.buyerIdNumber ? [[w.buyerId, `${w.idTypes[t.buyerIdType]} · ${t.buyerIdNumber}`] as const] : []),
      [w.price, formatCents(t.priceCents)],
      [w.date, calendarDay(t.date, language)],
    ],
    { labelWidth: LABEL_WIDTH },
  )
  const v = d.vehicle
  sheet.heading(`${w.vehicle} · ${v.stockNumber}`, 2)
  sheet.labelValues(
    [
      [w.vin, v.vin ?? w.none],
      [w.year, v.year !== null ? String(v.year) : w.none],
      [w.make, v.make ?? w.none],
      [w.model, v.model ?? w.none],
      [w.plate, v.plate ? [v.plate, v.plateState].filter(Boolean).join(' · ') : w.none],
    ],
    { labelWidth: LABEL_WIDTH },
  )

  if (d.proceeds) {
    sheet.heading(w.proceeds, 2)
    sheet.moneyTable(
      [
        { label: w.salePrice, cents: t.priceCents },
        { label: w.applied, cents: -d.proceeds.appliedCents },
      ],
      { label: w.surplus, cents: d.proceeds.surplusCents },
      formatCents,
    )
    sheet.space(4)
    sheet.paragraph(w.dueOnSaleDay(formatCents(d.proceeds.dueCents), formatCents(d.proceeds.shortfallCents)), { size: 9 })
    sheet.paragraph(w.surplusNote, { size: 9, colour: 'muted' })
  }

  sheet.heading(d.odometer.required ? w.odometerTitle : w.odometerTitle.replace(/ \(.*\)$/, ''), 2)
  if (d.odometer.required) {
    sheet.paragraph(w.odometerWarning, { size: 9 })
    if (t.odometerUnreadable || t.odometer === null) sheet.paragraph(w.odometerUnreadable, { size: 9.5, font: 'medium' })
    else {
      sheet.paragraph(w.odometerReads(number(t.odometer)), { size: 9.5, font: 'medium' })
      checkboxes(sheet, w.odometerBoxes)
    }
  } else sheet.paragraph(w.odometerExempt(d.odometer.reason, d.odometer.clause), { size: 9.5 })

  sheet.heading(w.checklist, 2)
  checkboxes(sheet, w.checklistItems(t.kind, d.odometer.required, t.buyerKind !== 'yard'))

  sheet.heading(w.signatures, 2)
  const at = (date: Date) => yardDateTime(date, d.yard.timeZone, language)
  if (d.signature) {
    const image = isPng(d.signature.image) ? await sheet.doc.embedPng(d.signature.image) : await sheet.doc.embedJpg(d.signature.image)
    const width = Math.min(170, image.width)
    const height = (image.height / image.width) * width
    sheet.ensure(height + 40)
    sheet.page.drawImage(image, { x: sheet.left, y: sheet.y - height, width, height })
    sheet.y -= height + 2
  } else sheet.ensure(60)
  signatureLine(sheet, w.sellerSignature, w.dateLine, Boolean(d.signature))
  if (d.signature) sheet.paragraph(w.signedBy(d.signature.signerName, at(d.signature.signedAt)), { size: 9 })
  sheet.space(22)
  signatureLine(sheet, w.buyerSignature, w.dateLine, false)

  sheet.caution()
  sheet.paragraph(w.printed(at(d.printedAt)), { size: 8, colour: 'muted' })
  return sheet.finish()
}

/** Lines of text each beside an empty box, to tick by hand. */
function checkboxes(sheet: Sheet, items: readonly string[]) {
  const size = 9.5
  const box = 8
  for (const item of items) {
    const lines = sheet.wrap(item, sheet.contentWidth - 18, { size })
    sheet.ensure(lines.length * size * 1.3 + 4)
    sheet.page.drawRectangle({ x: sheet.left + 2, y: sheet.y - size - 0.5, width: box, height: box, borderColor: sheet.colour('ink'), borderWidth: 0.75 })
    sheet.paragraph(item, { size, indent: 18, after: 3 })
  }
  sheet.space(4)
}

/** A line to sign on, its label under it, and a shorter line for the date. */
function signatureLine(sheet: Sheet, label: string, dateLabel: string, signed: boolean) {
  sheet.ensure(36)
  if (!signed) sheet.space(24)
  const y = sheet.y
  const dateX = sheet.left + sheet.contentWidth * 0.65
  sheet.page.drawLine({ start: { x: sheet.left, y }, end: { x: dateX - 20, y }, thickness: 0.75, color: sheet.colour('ink') })
  sheet.page.drawLine({ start: { x: dateX, y }, end: { x: sheet.right, y }, thickness: 0.75, color: sheet.colour('ink') })
  sheet.text(label, sheet.left, y - 11, { size: 8.5, colour: 'muted' })
  sheet.text(dateLabel, dateX, y - 11, { size: 8.5, colour: 'muted' })
  sheet.y = y - 18
}
