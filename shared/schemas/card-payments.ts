import { z } from 'zod'
import { LOCALES } from '../messages/locales'
import { paymentAnswerSchema, invoiceSchema } from './billing'
import { requiredText } from './fields'
import { msg } from './field-messages'

/** Made by the client once per attempt to pay by card; a retry or a second tap sends the same one. */
const idempotencyKey = z.uuid({ error: msg('common.requestHasNoValid', 'The request has no valid idempotency key: reload the page and try again.') })

const receiptEmail = z
  .preprocess((v) => (typeof v === 'string' && v.trim() === '' ? null : v), z.email({ error: msg('common.enterMailAddressSuch', 'Enter an e-mail address such as name@example.com, or leave it empty.') }).max(254).nullish())
  .transform((v) => v ?? null)

/** The payment service's own floor for one card payment in dollars. */
export const CARD_MINIMUM_CENTS = 50

/** At the counter: all that is due, or a part of it, paid by the customer on the hosted card page. */
export const cardCheckoutInputSchema = z.object({
  idempotencyKey,
  /** Left out: everything that is due. */
  amountCents: z
    .number({ error: msg('cardPayments.enterAmount', 'Enter the amount.') })
    .int(msg('cardPayments.enterAmountCent', 'Enter the amount to the cent.'))
    .min(CARD_MINIMUM_CENTS, msg('cardPayments.cardPaymentMustAt', 'A card payment must be at least $0.50.'))
    .max(100_000_000, msg('cardPayments.amountCannotAbove1', 'The amount cannot be above $1,000,000.00.'))
    .nullish()
    .transform((v) => v ?? null),
  receiptEmail,
  language: z.enum(LOCALES).default('en'),
})
export type CardCheckoutInput = z.input<typeof cardCheckoutInputSchema>
export type CardCheckoutRequest = z.output<typeof cardCheckoutInputSchema>

/** From the owner's page: always everything that is due. */
export const ownerCardCheckoutInputSchema = z.object({ idempotencyKey, receiptEmail, language: z.enum(LOCALES).default('en') })
export type OwnerCardCheckoutInput = z.input<typeof ownerCardCheckoutInputSchema>

export const CARD_CHECKOUT_STATUSES = ['open', 'paid', 'expired', 'refused'] as const

export const cardCheckoutSchema = z.object({
  id: z.uuid(),
  status: z.enum(CARD_CHECKOUT_STATUSES),
  amountCents: z.number(),
  /** The hosted page to send the payer to while the checkout is open. */
  url: z.string().nullable(),
  expiresAt: z.string(),
  paymentId: z.uuid().nullable(),
  /** Paid but not recorded against the bill, and why (the vehicle had left, more than was due): to be refunded. */
  refusal: z.string().nullable(),
  /** The same key was sent before: this is the checkout it opened. */
  replayed: z.boolean(),
})
export type CardCheckout = z.infer<typeof cardCheckoutSchema>

export const cardCheckoutParamsSchema = z.object({
  vehicleId: z.uuid({ error: msg('common.thatNotVehicleId', 'That is not a vehicle id.') }),
  checkoutId: z.uuid({ error: msg('cardPayments.thatNotCardPayment', 'That is not a card payment id.') }),
})

/**
 * A manager gives back money paid by card on the hosted page, through the payment service: all of that
 * payment or a part of it, with the reason. Recorded once the service confirms the refund.
 */
export const cardRefundInputSchema = z.object({
  idempotencyKey,
  paymentId: z.uuid({ error: msg('cardPayments.chooseCardPaymentRefund', 'Choose the card payment to refund.') }),
  amountCents: z
    .number({ error: msg('cardPayments.enterAmountRefund', 'Enter the amount to refund.') })
    .int(msg('cardPayments.enterAmountCent', 'Enter the amount to the cent.'))
    .positive(msg('cardPayments.refundMustMoreThan', 'The refund must be more than $0.00.'))
    .max(100_000_000, msg('cardPayments.amountCannotAbove1', 'The amount cannot be above $1,000,000.00.')),
  reason: requiredText(500, msg('common.sayWhyMoneyGiven', 'Say why the money is given back.')),
})
export type CardRefundInput = z.input<typeof cardRefundInputSchema>
export type CardRefund = z.output<typeof cardRefundInputSchema>

/**
 * The service took the refund but has not finished it (a bank can take days): nothing is on the bill yet;
 * the vehicle's history says it was sent, and the service's `refund.updated` webhook records it when it ends.
 */
export const pendingRefundAnswerSchema = z.object({
  pending: z.object({ providerReference: z.string(), amountCents: z.number().int() }),
  invoice: invoiceSchema,
})
export const cardRefundAnswerSchema = z.union([paymentAnswerSchema, pendingRefundAnswerSchema])
export type CardRefundAnswer = z.infer<typeof cardRefundAnswerSchema>
