import type { AuthorityKind, ClaimantKind, IdType } from '@shared/schemas/releases'
import type { Disposition } from '@shared/domain/lifecycle'
import { formatCents } from '@shared/domain/billing'
import { letterhead, type YardHeading } from './letterhead'
import { RELEASE_WORDS, yardDateTime } from './release-words'
import { LETTER, Sheet } from './sheet'
import type { Language } from './words'

export interface ReleaseFormData {
  yard: YardHeading & { timeZone: string }
  vehicle: { stockNumber: string; vin: string | null; year: number | null; make: string | null; model: string | null; colour: string | null; plate: string | null; plateState: string | null; arrivedAt: Date }
  claimant: {
    kind: ClaimantKind
    name: string
    actingFor: string | null
    idType: IdType
    idNumber: string
    idIssuer: string
    idExpiry: string
    authorityKind: AuthorityKind
    authorityReference: string
  } | null
  disposition: Disposition | null
  odometer: number | null
  odometerUnreadable: boolean
  charges: { towCents: number; storageCents: number; days: number; paidCents: number; waived: boolean } | null
  property: { item: string; count: number; returned: boolean | null; note: string | null }[]
  signature: { jpeg: Uint8Array; signerName: string; signedAt: Date } | null
  printedAt: Date
}

// Wide enough for the longest label in either language ("Prueba de propiedad o autorización").
const LABEL_WIDTH = 170

/**
 * The release form (issue 11): the yard, the vehicle and its stock number, who collected it and their
 * ID record, the charges and what was paid, the property handed back, the signature, date and time,
 * and the caution every legal document carries.
 */
export async function releaseForm(d: ReleaseFormData, language: Language): Promise<Uint8Array> {
  const w = RELEASE_WORDS[language]
  const margin = 0.6 * 72
  const sheet = await Sheet.create({ ...LETTER, margin: { top: margin, right: margin, bottom: margin, left: margin }, title: `${w.formTitle} ${d.vehicle.stockNumber}`, language })
  const at = (date: Date) => yardDateTime(date, d.yard.timeZone, language)
  letterhead(sheet, d.yard, w.formTitle)

  const v = d.vehicle
  sheet.heading(`${w.vehicle} · ${v.stockNumber}`, 2)
  sheet.labelValues([
    [w.vehicle, [[v.year, v.make, v.model].filter(Boolean).join(' ') || w.none, v.colour].filter(Boolean).join(', ')],
    [w.vin, v.vin ?? w.none],
    [w.plate, v.plate ? [v.plate, v.plateState].filter(Boolean).join(' · ') : w.none],
    [w.arrived, at(v.arrivedAt)],
    [w.odometer, d.odometerUnreadable ? w.unreadable : d.odometer !== null ? d.odometer.toLocaleString(language === 'es' ? 'es-US' : 'en-US') : w.none],
    [w.disposition, d.disposition ? w.dispositions[d.disposition] : w.none],
  ], { labelWidth: LABEL_WIDTH })

  sheet.heading(w.collectedBy, 2)
  const c = d.claimant
  sheet.labelValues(
    c
      ? [
          [w.name, c.name],
          [w.capacity, w.claimantKinds[c.kind]],
          ...(c.actingFor ? [[w.actingFor, c.actingFor] as const] : []),
          [w.id, `${w.idTypes[c.idType]} · ${c.idNumber}`],
          [w.idIssuer, `${c.idIssuer} · ${w.idExpiry} ${c.idExpiry}`],
          [w.authority, `${w.authorityKinds[c.authorityKind]} · ${c.authorityReference}`],
        ]
      : [[w.name, w.none]],
    { labelWidth: LABEL_WIDTH },
  )

  if (d.charges) {
    sheet.heading(w.charges, 2)
    const ch = d.charges
    const total = ch.towCents + ch.storageCents
    sheet.moneyTable(
      [
        { label: w.tow, cents: ch.towCents },
        { label: w.storage(ch.days), cents: ch.storageCents },
        { label: ch.waived ? w.waived : w.paid, cents: -Math.min(ch.waived ? total : ch.paidCents, total) },
      ],
      { label: w.due, cents: ch.waived ? 0 : Math.max(0, total - ch.paidCents) },
      formatCents,
    )
  }

  sheet.heading(w.property, 2)
  if (d.property.length === 0) sheet.paragraph(w.noProperty, { colour: 'muted' })
  else {
    sheet.labelValues(
      d.property.map((p) => [p.returned ? w.returned : p.returned === false ? w.notReturned : '—', `${p.count > 1 ? `${p.count} × ` : ''}${p.item}${p.note ? ` — ${p.note}` : ''}`]),
      { labelWidth: 110 },
    )
  }

  sheet.heading(w.signature, 2)
  sheet.paragraph(w.statement, { size: 9 })
  if (d.signature) {
    const image = await sheet.doc.embedJpg(d.signature.jpeg)
    const width = Math.min(180, image.width)
    const height = (image.height / image.width) * width
    sheet.ensure(height + 24)
    sheet.page.drawImage(image, { x: sheet.left, y: sheet.y - height, width, height })
    sheet.y -= height + 4
    sheet.rule('ink', 0.75)
    sheet.space(4)
    sheet.paragraph(w.signedBy(d.signature.signerName, at(d.signature.signedAt)), { size: 9 })
  } else sheet.paragraph(w.notSigned, { colour: 'brick' })

  sheet.caution()
  sheet.paragraph(w.printed(at(d.printedAt)), { size: 8, colour: 'muted' })
  return sheet.finish()
}
