import { readFileSync } from 'node:fs'
import { join } from 'node:path'
import Stripe from 'stripe'
import { describe, expect, it } from 'vitest'
import { CARD_REASONS, cardReasonOf, cardReasonOfError } from '../../../server/card-payments/service-reasons'

// The payment service's codes as its documentation names them: decline codes (docs.stripe.com/declines/codes),
// API error codes (docs.stripe.com/error-codes) and a refund's failure_reason (docs.stripe.com/api/refunds/object).
const catalog = (locale: string) =>
  JSON.parse(readFileSync(join(import.meta.dirname, `../../../shared/messages/${locale}/refusals.json`), 'utf8')).refusals.cardReasons as Record<string, string>

describe('why the card payment service said no, in our words', () => {
  it.each([
    ['insufficient_funds', 'funds'],
    ['lost_or_stolen_card', 'cardClosed'],
    ['expired_card', 'cardClosed'],
    ['incorrect_cvc', 'cardDetails'],
    ['authentication_required', 'authentication'],
    ['currency_not_supported', 'notSupported'],
    ['fraudulent', 'declined'],
    ['do_not_honor', 'declined'],
    ['processing_error', 'tryAgain'],
    ['charge_already_refunded', 'refunded'],
    ['charge_for_pending_refund_disputed', 'disputed'],
    ['amount_too_large', 'amount'],
    ['merchant_request', 'canceled'],
    ['api_key_expired', 'setup'],
    ['a_code_added_next_year', 'other'],
  ])('%s reads as %s', (code, reason) => {
    expect(cardReasonOf(code)).toBe(reason)
  })

  it('takes the decline code before the general card_declined, and no code at all as other', () => {
    expect(cardReasonOf('insufficient_funds', 'card_declined')).toBe('funds')
    expect(cardReasonOf(undefined, 'card_declined')).toBe('declined')
    expect(cardReasonOf(null, undefined)).toBe('other')
  })

  it('reads an SDK error by its decline code, and no answer at all as noAnswer', () => {
    const declined = Stripe.errors.StripeError.generate({ type: 'card_error', code: 'card_declined', decline_code: 'stolen_card', message: 'Your card was declined.' })
    expect(cardReasonOfError(declined)).toBe('cardClosed')
    expect(cardReasonOfError(new Error('socket hang up'))).toBe('noAnswer')
  })

  it.each(['en', 'es'])('every reason has words in %s', (locale) => {
    const words = catalog(locale)
    expect(CARD_REASONS.filter((r) => typeof words[r] !== 'string')).toEqual([])
    expect(Object.keys(words).sort()).toEqual([...CARD_REASONS].sort())
  })
})
