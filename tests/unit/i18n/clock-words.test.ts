import { beforeAll, describe, expect, it } from 'vitest'
import floridaJson from '../../../server/rule-sets/samples/florida.json' with { type: 'json' }
import { type ClockEvent, legalClocks } from '@shared/domain/clocks'
import { ruleSetSchema } from '@shared/schemas/rule-sets'
import type { ClockExplanationView } from '@shared/schemas/clock-explanations'
import { clockExplanation } from '@/composables/clock-words'
import { i18n, loadMessages } from '@/i18n'
import { usFederalCalendar } from '../../helpers/us-federal-holidays'

// A deadline's explanation travels as facts (issue 14) and reads in the reader's language. The case is
// the one of tests/unit/domain/legal-clocks.test.ts: Florida's notice of lien, stored Tue 30 Jun 2026,
// due 7 business days later on Fri 10 Jul, skipping a weekend and Independence Day observed on Fri 3 Jul
// (5 U.S.C. 6103: a Saturday holiday is observed the Friday before).
const florida = ruleSetSchema.parse(floridaJson)
const stored: ClockEvent = { kind: 'stored', at: '2026-06-30T15:00:00-04:00' }
const notice = () => legalClocks({ modelYear: 2018 }, [stored], florida, usFederalCalendar(), '2026-07-01T00:00:00Z').deadlines.find((d) => d.code === 'notice-of-lien')!

describe('deadline explanations in the reader’s language', () => {
  beforeAll(() => Promise.all([loadMessages('en'), loadMessages('es')]), 60_000)

  it('the core gives the facts beside its English', () => {
    expect(notice().explained).toEqual({
      code: 'step',
      kind: 'deadline',
      days: 7,
      dayKind: 'business',
      direction: 'after',
      from: 'stored',
      start: '2026-06-30',
      date: '2026-07-10',
      weekendDays: 2,
      holidays: [{ date: '2026-07-03', name: 'Independence Day (observed)' }],
    })
  })

  it('reads in English as the core says it, with the dates in the date look', () => {
    i18n.global.locale.value = 'en'
    const d = notice()
    expect(clockExplanation(d.explained, d.explanation)).toBe(
      '7 business days after the vehicle was placed in storage (30 Jun 2026): due by 10 Jul 2026, ' +
        'skipping 2 weekend days and Independence Day (observed) (3 Jul 2026).',
    )
  })

  // Intl.ListFormat joins as Spanish does: "y" becomes "e" before a word starting with an i sound.
  it('reads in Spanish as a clerk says it', () => {
    i18n.global.locale.value = 'es'
    const d = notice()
    expect(clockExplanation(d.explained, d.explanation)).toBe(
      '7 días hábiles después del ingreso del vehículo al almacenaje (30 jun 2026): vence el 10 jul 2026, ' +
        'sin contar 2 días de fin de semana e Independence Day (observed) (3 jul 2026).',
    )
  })

  it('says why a mailing moved to the day before, in Spanish', () => {
    i18n.global.locale.value = 'es'
    // The reference case of tests/reference/legal-clocks.reference.test.ts: the 31st day before a sale on
    // Wed 17 Jun 2026 is Sun 17 May; the notice is due by Fri 15 May.
    const moved: ClockExplanationView = { code: 'step', kind: 'deadline', days: 31, dayKind: 'calendar', direction: 'before', from: 'sale-scheduled', start: '2026-06-17', date: '2026-05-15', counted: '2026-05-17', closed: { weekday: 0 } }
    expect(clockExplanation(moved, 'English')).toBe(
      '31 días calendario antes de la fecha de la venta (17 jun 2026): 17 may 2026; el correo está cerrado el 17 may 2026 (domingo), así que hay que enviarlo el día anterior en que abra, el 15 may 2026.',
    )
  })

  it('words a step not yet started, the lien sale and the police clock', () => {
    i18n.global.locale.value = 'es'
    expect(clockExplanation({ code: 'step', kind: 'earliest', days: 1, dayKind: 'business', direction: 'after', from: 'lien-notice-mailed' }, 'English')).toBe(
      '1 día hábil después del envío del aviso del patio de venta por gravamen pendiente.',
    )
    expect(clockExplanation({ code: 'eligible-since', date: '2026-12-01' }, 'English')).toBe('Apto para venta por gravamen o desecho desde el 1 dic 2026.')
    // 18:00 UTC is 10:00 in Los Angeles in December (PST, UTC−8).
    const police = clockExplanation({ code: 'police', hours: 1, start: 'arrived', startAt: '2026-12-01T17:00:00Z', dueAt: '2026-12-01T18:00:00Z' }, 'English', 'America/Los_Angeles')
    expect(police).toMatch(/^1 hora después de la llegada al patio \(.*09:00 PST\): vence el .*10:00 PST\.$/)
  })

  it('shows the English as it came from a server without the facts', () => {
    i18n.global.locale.value = 'es'
    expect(clockExplanation(undefined, 'Due by 2026-12-01.')).toBe('Due by 2026-12-01.')
  })
})
