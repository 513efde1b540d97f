import { formatCents } from '@shared/domain/billing'
import type { ContactRole } from '@shared/schemas/contacts'
import type { NoticeKind } from '@shared/schemas/notices'
import { LETTER, letterhead, qrWithLink, Sheet, type Language } from '../documents/index'
import { LETTER_WORDS, longDate } from './letter-words'

export interface LetterCharges {
  days: number
  towCents: number
  storageCents: number
  balanceCents: number
}

export interface NoticeLetter {
  kind: NoticeKind
  language: Language
  /** The day the letter is dated, on the yard's calendar. */
  date: string
  yard: { name: string; address: string; phone: string | null; hours: string | null }
  recipient: { name: string; role: ContactRole; addressLines: string[] }
  vehicle: { stockNumber: string; vin: string | null; year: number | null; make: string | null; model: string | null; plate: string | null; plateState: string | null }
  chargesToday: LetterCharges | null
  /** What collecting on the next step's date would cost (the most that day can cost). */
  chargesAtNext: LetterCharges | null
  /** The first day the yard may sell or dispose of it once this notice is mailed. */
  nextDate: string | null
  /** Mail by this day, where the rule set says. */
  dueDate: string | null
  rule: { label: string; citation: string; ruleSetName: string; ruleSetCaution: string }
  owner: { url: string; site: string; code: string }
}

/** One notice letter (US Letter, Holdfast's own layout) in the recipient's language. */
export async function noticeLetter(n: NoticeLetter): Promise<Uint8Array> {
  const w = LETTER_WORDS[n.language]
  const inch = 72
  const sheet = await Sheet.create({
    ...LETTER,
    margin: { top: 0.6 * inch, right: 0.75 * inch, bottom: 0.7 * inch, left: 0.75 * inch },
    title: `${w.title(n.kind)} ${n.vehicle.stockNumber}`,
    language: n.language,
  })
  letterhead(sheet, n.yard, n.vehicle.stockNumber)
  sheet.heading(w.title(n.kind))
  sheet.labelValues([
    [w.dated, longDate(n.date, n.language)],
    [w.to, [n.recipient.name, ...n.recipient.addressLines].join('\n')],
  ])
  sheet.paragraph(w.why(n.recipient.role, n.yard.name))

  sheet.heading(w.vehicle, 2)
  const v = n.vehicle
  const ymm = [v.year, v.make, v.model].filter(Boolean).join(' ')
  const plate = v.plate ? [v.plate, v.plateState].filter(Boolean).join(' · ') : ''
  sheet.labelValues([
    [w.stock, v.stockNumber],
    [w.vin, v.vin ?? w.unknown],
    [w.yearMakeModel, ymm || w.unknown],
    [w.plate, plate || w.unknown],
  ])

  if (n.chargesToday) {
    sheet.heading(w.chargesTitle, 2)
    sheet.paragraph(w.chargesAsOf(longDate(n.date, n.language)), { font: 'medium' })
    const c = n.chargesToday
    sheet.moneyTable(
      [
        { label: w.tow, cents: c.towCents },
        { label: w.storage(c.days), cents: c.storageCents },
      ],
      { cents: c.balanceCents },
      formatCents,
    )
    if (n.chargesAtNext && n.nextDate) {
      // The total on the day of the next step, under the table's total and in its column.
      const label = w.totalAt(longDate(n.nextDate, n.language))
      const amount = formatCents(n.chargesAtNext.balanceCents)
      sheet.space(14)
      sheet.text(label, sheet.left, sheet.y, { font: 'medium' })
      sheet.text(amount, sheet.right - sheet.width(amount, { font: 'medium' }), sheet.y, { font: 'medium' })
      sheet.space(6)
    }
    sheet.paragraph(w.accrues, { colour: 'muted', size: 9 })
  }

  sheet.heading(w.nextTitle, 2)
  sheet.paragraph(n.nextDate ? w.next[n.kind](longDate(n.nextDate, n.language)) : w.nextUnknown)

  sheet.heading(w.backTitle, 2)
  sheet.paragraph(w.back(n.yard.name, n.yard.address))
  if (n.yard.hours) sheet.paragraph(w.hours(n.yard.hours))
  if (n.yard.phone) sheet.paragraph(w.call(n.yard.phone))

  // The code stays with its heading and words: never a QR alone at the top of a page.
  sheet.ensure(84 + 60)
  sheet.heading(w.onlineTitle, 2)
  sheet.paragraph(w.online, { size: 9, colour: 'muted' })
  qrWithLink(sheet, n.owner.url, w.orCode(n.owner.site), n.owner.code, 84)

  sheet.heading(w.ruleTitle, 2)
  sheet.paragraph(`${n.rule.label} — ${n.rule.citation}`, { size: 9 })
  if (n.dueDate) sheet.paragraph(w.dueBy(longDate(n.dueDate, n.language)), { size: 9 })
  sheet.paragraph(`${w.ruleSet(n.rule.ruleSetName)}. ${n.rule.ruleSetCaution}`, { size: 8, colour: 'muted' })
  sheet.caution()
  return sheet.finish()
}
