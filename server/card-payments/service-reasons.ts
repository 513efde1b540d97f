import Stripe from 'stripe'

/**
 * Why the card payment service said no, in a word of our own that the catalogs word
 * (`refusals.cardReasons.<reason>`): the service's codes never reach a person. The codes are the payment
 * service's documented ones — its card decline codes (docs.stripe.com/declines/codes), its API error codes
 * (docs.stripe.com/error-codes) and a refund's `failure_reason` (docs.stripe.com/api/refunds/object).
 * A code not listed, and an error without one, read as `other`.
 */
const REASONS = {
  funds: ['insufficient_funds', 'card_velocity_exceeded', 'withdrawal_count_exceeded'],
  cardClosed: ['expired_card', 'expired_or_canceled_card', 'lost_or_stolen_card', 'lost_card', 'stolen_card', 'pickup_card', 'restricted_card', 'invalid_account', 'new_account_information_available'],
  cardDetails: ['incorrect_number', 'invalid_number', 'incorrect_cvc', 'invalid_cvc', 'invalid_expiry_month', 'invalid_expiry_year', 'incorrect_zip', 'incorrect_pin', 'invalid_pin', 'pin_try_exceeded', 'offline_pin_required', 'online_or_offline_pin_required'],
  authentication: ['authentication_required', 'approve_with_id'],
  notSupported: ['card_not_supported', 'currency_not_supported', 'service_not_allowed', 'transaction_not_allowed'],
  // Fraud and the like are not told to the customer as such (the service's own advice): a plain decline.
  declined: ['card_declined', 'declined', 'generic_decline', 'do_not_honor', 'do_not_try_again', 'call_issuer', 'no_action_taken', 'not_permitted', 'fraudulent', 'merchant_blacklist', 'security_violation', 'stop_payment_order', 'revocation_of_all_authorizations', 'revocation_of_authorization', 'testmode_decline'],
  tryAgain: ['processing_error', 'try_again_later', 'issuer_not_available', 'reenter_transaction', 'rate_limit', 'lock_timeout', 'idempotency_key_in_use'],
  duplicate: ['duplicate_transaction'],
  refunded: ['charge_already_refunded'],
  disputed: ['charge_disputed', 'charge_for_pending_refund_disputed', 'refund_disputed_payment'],
  amount: ['amount_too_large', 'amount_too_small', 'invalid_amount', 'balance_insufficient'],
  canceled: ['merchant_request', 'canceled'],
  setup: ['api_key_expired', 'secret_key_required', 'account_invalid', 'platform_api_key_expired', 'testmode_charges_only'],
} as const satisfies Record<string, readonly string[]>

export type CardReason = keyof typeof REASONS | 'noAnswer' | 'other'

/** Every reason the catalogs word (`refusals.cardReasons`). */
export const CARD_REASONS = [...Object.keys(REASONS), 'noAnswer', 'other'] as CardReason[]

const BY_CODE = new Map<string, CardReason>(Object.entries(REASONS).flatMap(([reason, codes]) => codes.map((c) => [c, reason as CardReason])))

/** Our word for one of the service's codes (a decline code first: it is the more exact). */
export function cardReasonOf(...codes: (string | null | undefined)[]): CardReason {
  for (const c of codes) if (c && BY_CODE.has(c)) return BY_CODE.get(c)!
  return 'other'
}

/** Our word for an error the service's SDK threw; no answer at all reads as `noAnswer`. */
export function cardReasonOfError(err: unknown): CardReason {
  if (!(err instanceof Stripe.errors.StripeError)) return 'noAnswer'
  if (err instanceof Stripe.errors.StripeConnectionError) return 'noAnswer'
  return cardReasonOf(err.decline_code, err.code)
}
