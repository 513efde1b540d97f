import enLifecycle from '@shared/messages/en/lifecycle.json'
import esLifecycle from '@shared/messages/es/lifecycle.json'
import type { Salvage } from '@shared/schemas/reports'
import { LETTER, letterhead, Sheet, type Language, type YardHeading } from '../documents/index'

const WORDS = {
  en: {
    title: 'Monthly salvage inventory',
    rule: 'Inventory of vehicles obtained as junk or salvage in the month (28 CFR 25.56).',
    entity: 'Reporting entity',
    month: 'Month',
    printed: 'Printed',
    count: 'Vehicles',
    none: 'No vehicle was obtained as junk or salvage in this month.',
    vin: 'VIN',
    obtained: 'Date obtained',
    from: 'Obtained from',
    disposition: 'Disposition',
    crushed: 'Crushed',
    to: 'Disposed of to',
    export: 'For export',
    yes: 'yes',
    no: 'no',
    notRecorded: 'not recorded',
    unknown: 'unknown',
  },
  es: {
    title: 'Inventario mensual de salvamento',
    rule: 'Inventario de vehículos obtenidos como chatarra o salvamento en el mes (28 CFR 25.56).',
    entity: 'Quien reporta',
    month: 'Mes',
    printed: 'Impreso',
    count: 'Vehículos',
    none: 'Ningún vehículo se obtuvo como chatarra o salvamento en este mes.',
    vin: 'VIN',
    obtained: 'Fecha en que se obtuvo',
    from: 'Obtenido de',
    disposition: 'Destino',
    crushed: 'Compactado',
    to: 'Entregado a',
    export: 'Para exportación',
    yes: 'sí',
    no: 'no',
    notRecorded: 'sin registrar',
    unknown: 'desconocido',
  },
} as const satisfies Record<Language, unknown>

const DISPOSITIONS = {
  en: enLifecycle.lifecycle.dispositions as Record<string, string>,
  es: esLifecycle.lifecycle.dispositions as Record<string, string>,
}

/**
 * The monthly salvage inventory (28 CFR 25.56) on Letter paper: the yard as the reporting entity, then
 * one block per vehicle with the rule's columns — VIN, date obtained, from whom, disposition, crushed,
 * to whom, for export — and the legal caution (a paper filed with the authorities).
 */
export async function salvageInventoryPdf(report: Salvage, yard: YardHeading, language: Language, printedAt: Date): Promise<Uint8Array> {
  const w = WORDS[language]
  const sheet = await Sheet.create({ ...LETTER, margin: { top: 54, right: 54, bottom: 54, left: 54 }, title: `${w.title} ${report.month}`, language })
  letterhead(sheet, yard, `${w.title} \u2014 ${report.month}`)
  sheet.paragraph(w.rule, { size: 10, colour: 'muted' })
  sheet.labelValues([
    [w.entity, [yard.name, yard.address].filter(Boolean).join(', ')],
    [w.month, report.month],
    [w.printed, new Intl.DateTimeFormat(language === 'es' ? 'es-US' : 'en-GB', { dateStyle: 'medium', timeStyle: 'short', hourCycle: 'h23', timeZone: report.timeZone }).format(printedAt)],
    [w.count, String(report.rows.length)],
  ])
  if (report.rows.length === 0) sheet.paragraph(w.none)
  const yesNo = (v: boolean | null) => (v === null ? w.notRecorded : v ? w.yes : w.no)
  for (const r of report.rows) {
    sheet.ensure(110)
    sheet.heading(`${r.stockNumber}  ${r.vehicle}`, 2)
    sheet.labelValues(
      [
        [w.vin, r.vin ?? w.notRecorded],
        [w.obtained, r.obtainedOn],
        [w.from, r.fromWhom ?? w.unknown],
        [w.disposition, DISPOSITIONS[language][r.disposition] ?? r.disposition],
        [w.crushed, yesNo(r.crushed)],
        [w.to, r.toWhom ?? w.notRecorded],
        [w.export, yesNo(r.forExport)],
      ],
      { size: 9.5, labelWidth: 120 },
    )
  }
  sheet.caution()
  return sheet.finish()
}
