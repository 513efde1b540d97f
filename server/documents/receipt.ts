import { formatCents } from '@shared/domain/billing'
import type { PaymentRecord } from '@shared/schemas/billing'
import { letterhead, type YardHeading } from './letterhead'
import { LETTER, Sheet } from './sheet'
import type { Language } from './words'

export interface ReceiptInput {
  yard: YardHeading & { timeZone: string }
  vehicle: { stockNumber: string; year: number | null; make: string | null; model: string | null; plate: string | null; plateState: string | null; vin: string | null }
  payment: PaymentRecord
  /** What was owed just before this payment or refund (stored with it, so a reprint says the same). */
  dueBeforeCents: number
}

const WORDS = {
  en: {
    receipt: 'Receipt',
    refund: 'Refund receipt',
    number: 'Receipt no.',
    date: 'Date',
    vehicle: 'Vehicle',
    stock: 'Stock no.',
    plate: 'Plate',
    vin: 'VIN',
    method: 'Paid by',
    refundedBy: 'Refunded by',
    methods: { cash: 'Cash', check: 'Check', card: 'Card at the counter terminal', lien_sale: 'Lien-sale proceeds' },
    checkNumber: 'Check no.',
    terminal: 'Terminal reference',
    tendered: 'Cash handed over',
    change: 'Change given',
    reason: 'Reason',
    takenBy: 'Taken by',
    dueBefore: 'Owed before this payment',
    thisPayment: 'This payment',
    thisRefund: 'Refunded',
    dueAfter: 'Still owed',
    owedNow: 'Owed after the refund',
    paidInFull: 'Paid in full. Thank you.',
    storageNote: 'Storage keeps accruing by the day until the vehicle leaves the yard; the amount still owed is as of this receipt.',
    notRecorded: 'not recorded',
  },
  es: {
    receipt: 'Recibo',
    refund: 'Recibo de reembolso',
    number: 'Recibo n.º',
    date: 'Fecha',
    vehicle: 'Vehículo',
    stock: 'N.º de inventario',
    plate: 'Placa',
    vin: 'VIN',
    method: 'Forma de pago',
    refundedBy: 'Reembolsado en',
    methods: { cash: 'Efectivo', check: 'Cheque', card: 'Tarjeta en la terminal del mostrador', lien_sale: 'Producto de la venta por gravamen' },
    checkNumber: 'Cheque n.º',
    terminal: 'Referencia de la terminal',
    tendered: 'Efectivo recibido',
    change: 'Cambio entregado',
    reason: 'Motivo',
    takenBy: 'Atendió',
    dueBefore: 'Saldo antes de este pago',
    thisPayment: 'Este pago',
    thisRefund: 'Reembolsado',
    dueAfter: 'Saldo pendiente',
    owedNow: 'Saldo después del reembolso',
    paidInFull: 'Pagado por completo. Gracias.',
    storageNote: 'El almacenaje sigue sumando por día hasta que el vehículo salga del patio; el saldo pendiente es a la fecha de este recibo.',
    notRecorded: 'sin registrar',
  },
} as const satisfies Record<Language, unknown>

/** Receipt numbers are the payment's id, shortened: enough to find it, not a sequence to guess. */
export const receiptNumber = (paymentId: string) => paymentId.replace(/-/g, '').slice(0, 10).toUpperCase()

function when(iso: string, timeZone: string, language: Language) {
  return new Intl.DateTimeFormat(language === 'es' ? 'es-US' : 'en-GB', { dateStyle: 'medium', timeStyle: 'short', hourCycle: 'h23', timeZone }).format(new Date(iso))
}

/** The receipt for one payment or refund, Letter size, in Holdfast's own layout. */
export async function receiptPdf(input: ReceiptInput, language: Language): Promise<Uint8Array> {
  const w = WORDS[language]
  const { payment: p, vehicle: v } = input
  const refund = p.kind === 'refund'
  const title = refund ? w.refund : w.receipt
  const sheet = await Sheet.create({ ...LETTER, margin: { top: 54, right: 54, bottom: 54, left: 54 }, title: `${title} ${receiptNumber(p.id)}`, language })
  letterhead(sheet, input.yard, title)

  const ymm = [v.year, v.make, v.model].filter(Boolean).join(' ') || w.notRecorded
  const plate = v.plate ? [v.plate, v.plateState].filter(Boolean).join(' · ') : w.notRecorded
  const how: [string, string][] = [[refund ? w.refundedBy : w.method, w.methods[p.method]]]
  if (p.method === 'check' && p.checkNumber) how.push([w.checkNumber, p.checkNumber])
  if (p.method === 'card' && p.terminalReference) how.push([w.terminal, p.terminalReference])
  if (p.method === 'cash' && p.tenderedCents !== null) how.push([w.tendered, formatCents(p.tenderedCents)], [w.change, formatCents(p.changeCents ?? 0)])
  if (p.reason) how.push([w.reason, p.reason])
  sheet.labelValues([
    [w.number, receiptNumber(p.id)],
    [w.date, when(p.takenAt, input.yard.timeZone, language)],
    [w.stock, v.stockNumber],
    [w.vehicle, ymm],
    [w.plate, plate],
    [w.vin, v.vin ?? w.notRecorded],
    ...how,
    [w.takenBy, p.takenBy],
  ])
  sheet.space(6)
  const after = refund ? input.dueBeforeCents + p.amountCents : input.dueBeforeCents - p.amountCents
  sheet.moneyTable(
    [
      { label: w.dueBefore, cents: input.dueBeforeCents },
      { label: refund ? w.thisRefund : w.thisPayment, cents: refund ? p.amountCents : -p.amountCents },
    ],
    { label: refund ? w.owedNow : w.dueAfter, cents: after },
    formatCents,
  )
  sheet.space(18)
  if (!refund && after <= 0) sheet.paragraph(w.paidInFull, { size: 12, font: 'bold', colour: 'green' })
  else sheet.paragraph(w.storageNote, { size: 9, colour: 'muted' })
  return sheet.finish()
}
