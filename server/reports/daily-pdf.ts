import enLifecycle from '@shared/messages/en/lifecycle.json'
import esLifecycle from '@shared/messages/es/lifecycle.json'
import enTow from '@shared/messages/en/tow.json'
import esTow from '@shared/messages/es/tow.json'
import { formatCents } from '@shared/domain/billing'
import type { DailyReport } from '@shared/schemas/reports'
import { LETTER, letterhead, Sheet, type Language, type YardHeading } from '../documents/index'

const WORDS = {
  en: {
    title: 'Daily report',
    day: 'Day',
    printed: 'Printed',
    arrivals: 'Arrivals',
    releases: 'Vehicles out',
    none: 'None.',
    payments: 'Payments by method',
    methods: { cash: 'Cash', check: 'Check', card: 'Card' } as Record<string, string>,
    net: 'Taken, less refunds',
    refunds: 'refunds',
    count: 'entries',
    storage: 'Storage earned',
    storageNote: 'What the bills of the vehicles on the lot grew by over the day: storage, the rule set\u2019s fees and their tax, by each vehicle\u2019s own rule set.',
    storageOf: 'Vehicles on the lot that day',
    drawer: 'Cash drawer',
    recorded: 'Cash recorded',
    float: 'Opening float',
    expected: 'Expected in the drawer',
    counted: 'Counted',
    overShort: 'Over (+) or short (\u2212)',
    closedBy: 'Closed by',
    notClosed: 'The drawer of this day is not closed.',
  },
  es: {
    title: 'Reporte del día',
    day: 'Día',
    printed: 'Impreso',
    arrivals: 'Ingresos',
    releases: 'Salidas',
    none: 'Ninguno.',
    payments: 'Pagos por forma de pago',
    methods: { cash: 'Efectivo', check: 'Cheque', card: 'Tarjeta' } as Record<string, string>,
    net: 'Cobrado, menos reembolsos',
    refunds: 'reembolsos',
    count: 'movimientos',
    storage: 'Almacenaje del día',
    storageNote: 'Lo que crecieron en el día las cuentas de los vehículos en el patio: almacenaje, cargos del reglamento y su impuesto, según el reglamento de cada vehículo.',
    storageOf: 'Vehículos en el patio ese día',
    drawer: 'Caja',
    recorded: 'Efectivo registrado',
    float: 'Fondo de caja',
    expected: 'Esperado en caja',
    counted: 'Contado',
    overShort: 'Sobrante (+) o faltante (\u2212)',
    closedBy: 'Corte de caja por',
    notClosed: 'La caja de este día no está cerrada.',
  },
} as const satisfies Record<Language, unknown>

const LABELS = {
  en: { dispositions: enLifecycle.lifecycle.dispositions as Record<string, string>, reasons: enTow.tow.reasons as Record<string, string> },
  es: { dispositions: esLifecycle.lifecycle.dispositions as Record<string, string>, reasons: esTow.tow.reasons as Record<string, string> },
}

function time(iso: string, timeZone: string) {
  return new Intl.DateTimeFormat('en-GB', { timeStyle: 'short', hourCycle: 'h23', timeZone }).format(new Date(iso))
}

/** The daily report on Letter paper. Not a legal document: no legal caution. */
export async function dailyReportPdf(report: DailyReport, yard: YardHeading, language: Language, printedAt: Date): Promise<Uint8Array> {
  const w = WORDS[language]
  const l = LABELS[language]
  const sheet = await Sheet.create({ ...LETTER, margin: { top: 54, right: 54, bottom: 54, left: 54 }, title: `${w.title} ${report.date}`, language })
  letterhead(sheet, yard, `${w.title} \u2014 ${report.date}`)
  sheet.labelValues([
    [w.day, report.date],
    [w.printed, new Intl.DateTimeFormat(language === 'es' ? 'es-US' : 'en-GB', { dateStyle: 'medium', timeStyle: 'short', hourCycle: 'h23', timeZone: report.timeZone }).format(printedAt)],
  ])
  sheet.space(8)
  sheet.heading(`${w.arrivals} (${report.arrivals.length})`, 2)
  if (report.arrivals.length === 0) sheet.paragraph(w.none)
  for (const a of report.arrivals) sheet.paragraph(`${time(a.at, report.timeZone)}  ${a.stockNumber}  ${a.vehicle}${a.plate ? ` \u00b7 ${a.plate}` : ''}${a.towReason ? ` \u2014 ${l.reasons[a.towReason] ?? a.towReason}` : ''}`, { size: 10 })
  sheet.space(6)
  sheet.heading(`${w.releases} (${report.releases.length})`, 2)
  if (report.releases.length === 0) sheet.paragraph(w.none)
  for (const r of report.releases) sheet.paragraph(`${time(r.at, report.timeZone)}  ${r.stockNumber}  ${r.vehicle}${r.plate ? ` \u00b7 ${r.plate}` : ''}${r.disposition ? ` \u2014 ${l.dispositions[r.disposition] ?? r.disposition}` : ''}`, { size: 10 })
  sheet.space(6)
  sheet.heading(w.payments, 2)
  if (report.payments.length === 0) sheet.paragraph(w.none)
  else
    sheet.moneyTable(
      report.payments.map((m) => ({ label: `${w.methods[m.method] ?? m.method} (${m.count} ${w.count})`, cents: m.netCents, note: m.refundsCents ? `${w.refunds} ${formatCents(m.refundsCents)}` : undefined })),
      { label: w.net, cents: report.paymentsNetCents },
      formatCents,
    )
  sheet.space(6)
  sheet.heading(w.storage, 2)
  sheet.labelValues([[w.storage, formatCents(report.storageEarnedCents)], [w.storageOf, String(report.storageVehicles)]])
  sheet.paragraph(w.storageNote, { size: 9, colour: 'muted' })
  sheet.space(6)
  sheet.heading(w.drawer, 2)
  const c = report.closeout
  if (c) {
    sheet.labelValues([
      [w.float, formatCents(c.openingFloatCents)],
      [w.recorded, formatCents(c.recordedCents)],
      [w.expected, formatCents(c.expectedCents)],
      [w.counted, formatCents(c.countedCents)],
      [w.overShort, formatCents(c.overShortCents)],
      [w.closedBy, c.closedBy],
    ])
  } else {
    sheet.labelValues([[w.recorded, formatCents(report.cashRecordedCents)]])
    sheet.paragraph(w.notClosed, { size: 10, colour: 'muted' })
  }
  return sheet.finish()
}
