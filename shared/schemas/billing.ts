import { z } from 'zod'
import { ruleSetTitleSchema } from './rule-sets'
import { ADJUSTMENT_KINDS, ADJUSTMENT_STATUSES, COUNTER_PAYMENT_METHODS, PAYMENT_METHODS } from '../domain/billing/payments'
import { LOCALES } from '../messages/locales'
import { alongsideFieldIssues, optionalText, requiredText } from './fields'
import { type FieldWhat, msg, whatWords } from './field-messages'

/** A whole number of cents above zero, at most $1,000,000.00: more is a typing slip. */
const positiveCents = (what: FieldWhat, { words, Words } = whatWords(what)) =>
  z
    .number({ error: msg('common.enterWhat', `Enter ${words}.`, { what }) })
    .int(msg('billing.enterToTheCent', `Enter ${words} to the cent.`, { what }))
    .positive(msg('billing.moreThanZero', `${Words} must be more than zero.`, { what }))
    .max(100_000_000, msg('billing.aboveMillion', `${Words} cannot be above $1,000,000.00.`, { what }))

/** Made by the client once per payment it means to take; a retry or a second tap sends the same one. */
const idempotencyKey = z.uuid({ error: msg('common.requestHasNoValid', 'The request has no valid idempotency key: reload the page and try again.') })

export const paymentInputSchema = z
  .object({
    idempotencyKey,
    method: z.enum(COUNTER_PAYMENT_METHODS, { error: msg('billing.chooseCashCheckCard', 'Choose cash, check or card.') }),
    amountCents: positiveCents('amount'),
    /** Cash: what the customer handed over (the amount itself when left out). */
    tenderedCents: z.number({ error: msg('billing.enterCashHandedOver', 'Enter the cash handed over.') }).int(msg('billing.enterCashToCent', 'Enter the cash handed over to the cent.')).max(100_000_000).nullish().transform((v) => v ?? null),
    checkNumber: optionalText(30),
    terminalReference: optionalText(60),
    /** Where to e-mail the receipt; none when left empty. */
    receiptEmail: z
      .preprocess((v) => (typeof v === 'string' && v.trim() === '' ? null : v), z.email({ error: msg('common.enterMailAddressSuch', 'Enter an e-mail address such as name@example.com, or leave it empty.') }).max(254).nullish())
      .transform((v) => v ?? null),
    receiptLanguage: z.enum(LOCALES).default('en'),
  })
  .superRefine((p, ctx) => {
    if (p.method === 'cash' && typeof p.tenderedCents === 'number' && typeof p.amountCents === 'number' && p.tenderedCents < p.amountCents) {
      ctx.addIssue({ code: 'custom', path: ['tenderedCents'], message: msg('billing.cashHandedOverLess', 'The cash handed over is less than the amount paid.') })
    }
    if (p.method === 'check' && !p.checkNumber) ctx.addIssue({ code: 'custom', path: ['checkNumber'], message: msg('billing.enterCheckNumber', 'Enter the check number.') })
    if (p.method === 'card' && !p.terminalReference) {
      ctx.addIssue({ code: 'custom', path: ['terminalReference'], message: msg('billing.enterTerminalReferenceFor', "Enter the terminal's reference for this card payment (on its slip).") })
    }
  }, alongsideFieldIssues)
export type PaymentInput = z.input<typeof paymentInputSchema>
export type Payment = z.output<typeof paymentInputSchema>

export const refundInputSchema = z.object({
  idempotencyKey,
  method: z.enum(COUNTER_PAYMENT_METHODS, { error: msg('billing.chooseHowMoneyGoes', 'Choose how the money goes back: cash, check or card.') }),
  amountCents: positiveCents('refund'),
  reason: requiredText(500, msg('common.sayWhyMoneyGiven', 'Say why the money is given back.')),
  checkNumber: optionalText(30),
  terminalReference: optionalText(60),
})
export type RefundInput = z.input<typeof refundInputSchema>
export type Refund = z.output<typeof refundInputSchema>

export const adjustmentInputSchema = z.object({
  kind: z.enum(ADJUSTMENT_KINDS, { error: msg('billing.chooseWaiverDiscount', 'Choose a waiver or a discount.') }),
  amountCents: positiveCents('amount'),
  reason: requiredText(500, msg('billing.sayWhyChargeWaived', 'Say why the charge is waived or discounted.')),
})
export type AdjustmentInput = z.input<typeof adjustmentInputSchema>
export type Adjustment = z.output<typeof adjustmentInputSchema>

export const declineInputSchema = z.object({ reason: requiredText(500, msg('billing.sayWhyRequestDeclined', 'Say why the request is declined.')) })

export const invoiceQuerySchema = z.object({
  asOf: z.iso.datetime({ offset: true, error: msg('billing.enterAsDateAs', 'Enter the "as of" date as a date and time.') }).optional(),
})

export const invoiceLineSchema = z.object({
  kind: z.enum(['tow', 'storage', 'fee']),
  code: z.string(),
  label: z.string(),
  /** A fee's name in Spanish, where the rule set has it. */
  es: z.object({ label: z.string().optional() }).optional(),
  quantity: z.number(),
  unitCents: z.number(),
  amountCents: z.number(),
  taxCents: z.number(),
})

export const paymentRecordSchema = z.object({
  id: z.uuid(),
  kind: z.enum(['payment', 'refund']),
  method: z.enum(PAYMENT_METHODS),
  amountCents: z.number(),
  tenderedCents: z.number().nullable(),
  changeCents: z.number().nullable(),
  checkNumber: z.string().nullable(),
  terminalReference: z.string().nullable(),
  reason: z.string().nullable(),
  receiptEmail: z.string().nullable(),
  /** A card paid on the payment service's hosted page: the service's reference for it. */
  providerReference: z.string().nullable().default(null),
  /** A refund through the payment service: the card payment it gives money back on. */
  refundOfPaymentId: z.uuid().nullable().default(null),
  takenBy: z.string(),
  takenAt: z.string(),
})
export type PaymentRecord = z.infer<typeof paymentRecordSchema>

export const adjustmentRecordSchema = z.object({
  id: z.uuid(),
  kind: z.enum(ADJUSTMENT_KINDS),
  amountCents: z.number(),
  reason: z.string(),
  status: z.enum(ADJUSTMENT_STATUSES),
  requestedBy: z.string(),
  requestedById: z.uuid(),
  requestedAt: z.string(),
  decidedBy: z.string().nullable(),
  decidedAt: z.string().nullable(),
  declineReason: z.string().nullable(),
})
export type AdjustmentRecord = z.infer<typeof adjustmentRecordSchema>

export const invoiceSchema = z.object({
  vehicleId: z.uuid(),
  stockNumber: z.string(),
  /** The instant the charges run to: now, the chosen "as of", or the moment the vehicle left. */
  endsAt: z.string(),
  /** The vehicle has left: its bill stopped then and never grows again. */
  frozen: z.boolean(),
  storageDays: z.number(),
  lines: z.array(invoiceLineSchema),
  subtotalCents: z.number(),
  taxCents: z.number(),
  totalCents: z.number(),
  creditedCents: z.number(),
  paidCents: z.number(),
  refundedCents: z.number(),
  netPaidCents: z.number(),
  dueCents: z.number(),
  waived: z.boolean(),
  payments: z.array(paymentRecordSchema),
  adjustments: z.array(adjustmentRecordSchema),
  /** A waiver or discount above this waits for a second manager. */
  approvalLimitCents: z.number(),
  ruleSet: ruleSetTitleSchema,
  warnings: z.array(z.string()),
  /**
   * Sold at lien sale: the bill runs to the end of the sale day, the price paid the charges (a payment
   * line of method lien_sale) and what was left over is owed to the owner.
   */
  lienSale: z
    .object({ saleDate: z.string(), priceCents: z.number(), appliedCents: z.number(), surplusCents: z.number(), shortfallCents: z.number() })
    .nullable()
    .default(null),
})
export type Invoice = z.infer<typeof invoiceSchema>

export const paymentAnswerSchema = z.object({
  payment: paymentRecordSchema,
  /** The same key was sent before: this is the payment it recorded, nothing new was taken. */
  replayed: z.boolean(),
  invoice: invoiceSchema,
})
export type PaymentAnswer = z.infer<typeof paymentAnswerSchema>

export const adjustmentAnswerSchema = z.object({ adjustment: adjustmentRecordSchema, invoice: invoiceSchema })

/** A yard day, YYYY-MM-DD on the yard's calendar. */
export const businessDateSchema = z.iso.date({ error: msg('billing.enterDayAsYyyy', 'Enter the day as YYYY-MM-DD.') })

export const closeoutInputSchema = z.object({
  businessDate: businessDateSchema,
  openingFloatCents: z.number({ error: msg('billing.enterFloatDrawerOpened', 'Enter the float the drawer opened with.') }).int(msg('billing.enterFloatCent', 'Enter the float to the cent.')).min(0, msg('billing.floatCannotBelowZero', 'The float cannot be below zero.')).max(100_000_000),
  countedCents: z.number({ error: msg('billing.enterCashCountedDrawer', 'Enter the cash counted in the drawer.') }).int(msg('billing.enterCountCent', 'Enter the count to the cent.')).min(0, msg('billing.countCannotBelowZero', 'The count cannot be below zero.')).max(100_000_000),
  note: optionalText(500),
})
export type CloseoutInput = z.input<typeof closeoutInputSchema>

export const drawerMovementSchema = paymentRecordSchema.extend({ stockNumber: z.string(), vehicleId: z.uuid() })

export const closeoutRecordSchema = z.object({
  id: z.uuid(),
  businessDate: z.string(),
  openingFloatCents: z.number(),
  recordedCents: z.number(),
  expectedCents: z.number(),
  countedCents: z.number(),
  overShortCents: z.number(),
  note: z.string().nullable(),
  closedBy: z.string(),
  closedAt: z.string(),
})
export type CloseoutRecord = z.infer<typeof closeoutRecordSchema>

export const drawerSchema = z.object({
  businessDate: z.string(),
  today: z.string(),
  timeZone: z.string(),
  movements: z.array(drawerMovementSchema),
  /** Cash taken less cash refunded that day, by the payment records. */
  recordedCents: z.number(),
  closeout: closeoutRecordSchema.nullable(),
})
export type Drawer = z.infer<typeof drawerSchema>
