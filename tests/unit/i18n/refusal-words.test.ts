import { afterEach, beforeAll, describe, expect, it, vi } from 'vitest'
import { ApiError, requestEmpty } from '@/api/http'
import { fieldText } from '@/composables/field-words'
import { refusalText } from '@/composables/refusal-words'
import { i18n, loadMessages } from '@/i18n'

// The server's last English answers now carry codes (issue 14): the release's steps still to record, and
// a gate pass's instant, which reads on the clock of the yard that issued it, not the browser's.
describe('refusal parameters that become words', () => {
  beforeAll(() => Promise.all([loadMessages('en'), loadMessages('es')]), 60_000)

  it('names the release steps still to record, in Spanish', () => {
    i18n.global.locale.value = 'es'
    expect(refusalText('recordBeforeSigning', { steps: 'id-photo,handover' }, 'English')).toBe(
      'Registre esto antes de firmar la entrega: Foto de la identificación, Odómetro y pertenencias entregadas.',
    )
  })

  it('shows when a pass expired on its yard’s clock (18:30 UTC is 10:30 in Los Angeles in December)', () => {
    i18n.global.locale.value = 'es'
    const text = refusalText('passExpired', { at: '2026-12-03T18:30:00.000Z', timeZone: 'America/Los_Angeles' }, 'English')
    expect(text).toMatch(/^Este pase venció el .*10:30.*\. La oficina emite uno nuevo\.$/)
    expect(text).not.toContain('18:30')
  })

  it('says the sign-in wait in the reader’s language', () => {
    i18n.global.locale.value = 'es'
    expect(refusalText('signInWaitSeconds', { n: 40 }, 'English')).toBe('Demasiados intentos fallidos desde aquí. Espere 40 segundos e intente otra vez.')
    i18n.global.locale.value = 'en'
    expect(refusalText('signInWaitMinutes', { n: 4 }, 'English')).toBe('Too many failed sign-ins from here. Wait 4 minutes and try again.')
  })

  it('words why the card payment service said no in our words, and a reason it does not know as the general one', () => {
    i18n.global.locale.value = 'es'
    expect(refusalText('cardRefundNotMade', { cardReason: 'funds' }, 'English')).toBe(
      'El servicio de pagos con tarjeta no hizo el reembolso. El banco dice que no hay fondos suficientes en la cuenta. No se registró nada; intente otra vez.',
    )
    const unknown = refusalText('cardPageRefused', { cardReason: 'insufficient_funds' }, 'English')
    expect(unknown).toBe('El servicio de pagos con tarjeta no quiso abrir la página de pago. El servicio dio un motivo que Holdfast no conoce; aparece en la cuenta de pagos con tarjeta.')
    expect(unknown).not.toContain('insufficient_funds')
  })

  it('says why no sale date can be set with the sale page’s own words', () => {
    i18n.global.locale.value = 'en'
    expect(refusalText('saleDateBlocked', { blocked: 'needs-value' }, 'English')).toBe("No sale date can be set. Enter the vehicle's value to set a sale date.")
  })

  it('words a field’s amount, a notice kind and a day in the future in Spanish', () => {
    i18n.global.locale.value = 'es'
    expect(fieldText({ message: 'English', code: 'billing.refundAtMost', params: { paidCents: 6_000 } })).toBe('Se pueden reembolsar $60.00 como máximo.')
    expect(fieldText({ message: 'English', code: 'notices.ruleAsksNoLetter', params: { noticeKind: 'disposal_notice' } })).toMatch(/^Las reglas no piden «.+» para este vehículo\.$/)
    expect(fieldText({ message: 'English', code: 'notices.ruleAsksNoLetter', params: { noticeKind: 'disposal_notice' } })).not.toContain('disposal_notice')
    expect(fieldText({ message: 'English', code: 'common.cannotBeInFuture', params: { what: 'mailedOn' } })).toBe('El día de envío por correo no puede ser posterior a hoy.')
  })

  describe('a refused move, which answers the lifecycle’s reasons and no code', () => {
    afterEach(() => vi.unstubAllGlobals())

    it('reads as its reasons, each in the reader’s language', async () => {
      i18n.global.locale.value = 'es'
      const body = { error: 'Lift the dispute hold first.', reasons: [{ key: 'balance', params: { dueCents: 12_500 }, message: 'English balance.' }] }
      vi.stubGlobal('fetch', async () => new Response(JSON.stringify(body), { status: 422, headers: { 'content-type': 'application/json' } }))
      const refused = await requestEmpty('POST', '/api/vehicles/x/moves', {}).catch((e: unknown) => e)
      expect(refused).toBeInstanceOf(ApiError)
      expect((refused as ApiError).message).toBe(refusalText('reasons.balance', { dueCents: 12_500 }, 'English balance.'))
      expect((refused as ApiError).message).not.toContain('English')
    })
  })
})
