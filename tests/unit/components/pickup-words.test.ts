// @vitest-environment happy-dom
import { mount } from '@vue/test-utils'
import { afterEach, beforeAll, describe, expect, it } from 'vitest'
import { readFileSync } from 'node:fs'
import { join } from 'node:path'
import { CAUTIONS, DEFER_TO_MAKER, NEWTON_METRES_PER_FOOT_POUND_FORCE, PICKUP_BADGE_LABELS, TORQUE_FACTOR_NOTE, pickupBadge } from '@shared/domain/inspection'
import { i18n, loadMessages } from '@/i18n'
import InspectionsPickupBadge from '../../../src/components/inspections/InspectionsPickupBadge.vue'
import InspectionsSafety from '../../../src/components/inspections/InspectionsSafety.vue'

// The pickup badge, its reasons and the workshop cautions travel as codes (issue 14); the English
// the core keeps for older readers and the history must read as the English catalog does.
const global = { plugins: [i18n] }
// Read as plain JSON: the unit project compiles catalog imports into vue-i18n's message functions.
type Words = { badges: Record<string, string>; pickupReasons: Record<string, string>; cautions: Record<string, string>; cautionSources: Record<string, string>; deferToMaker: string }
const en = JSON.parse(readFileSync(join(import.meta.dirname, '../../../shared/messages/en/inspection.json'), 'utf8')) as { inspection: Words }
beforeAll(() => Promise.all([loadMessages('en'), loadMessages('es')]))
afterEach(() => {
  i18n.global.locale.value = 'en'
})

const yesNo = [true, false]
const every = yesNo.flatMap((rolls) => yesNo.flatMap((steers) => yesNo.flatMap((brakes) => (['yes', 'no', 'unknown'] as const).map((keys) => ({ rolls, steers, brakes, keys })))))

describe('the pickup badge and its reasons by code', () => {
  it('every badge and reason the core gives has a code whose English words are the core’s', () => {
    for (const marks of every) {
      const badge = pickupBadge(marks)!
      expect(en.inspection.badges[badge.code], badge.code).toBe(badge.label)
      expect(PICKUP_BADGE_LABELS[badge.code]).toBe(badge.label)
      expect(badge.reasonCodes.map((c) => en.inspection.pickupReasons[c])).toEqual(badge.reasons)
    }
  })

  it('a car that neither rolls nor has keys: flatbed or dollies, for both reasons', () => {
    const badge = pickupBadge({ rolls: false, steers: true, brakes: true, keys: 'unknown' })!
    expect(badge).toMatchObject({ code: 'flatbed-or-dollies', reasonCodes: ['no-roll', 'no-keys'], technicianFirst: true })
  })

  it('shows the badge in Spanish by its code', () => {
    i18n.global.locale.value = 'es'
    const w = mount(InspectionsPickupBadge, { props: { badge: pickupBadge({ rolls: true, steers: true, brakes: true, keys: 'no' })! }, global })
    expect(w.text()).toContain('De arrastre + dollies')
  })
})

describe('the workshop cautions in the reader’s language', () => {
  it('the English catalog reads as the core’s cautions', () => {
    for (const c of CAUTIONS) expect(en.inspection.cautions[c.code], c.code).toBe(c.text)
    expect(en.inspection.deferToMaker).toBe(DEFER_TO_MAKER)
  })

  it('the English catalog reads each caution’s source and the torque factor as the core does', () => {
    for (const c of CAUTIONS) expect(en.inspection.cautionSources[c.code], c.code).toBe(c.source)
    i18n.global.locale.value = 'en'
    expect(i18n.global.t('inspection.torqueFactor', { factor: NEWTON_METRES_PER_FOOT_POUND_FORCE })).toBe(TORQUE_FACTOR_NOTE)
  })

  it('in Spanish the sources are explained in Spanish, keeping each standard’s and statute’s name and quoted words as written', () => {
    i18n.global.locale.value = 'es'
    const w = mount(InspectionsSafety, { props: { acknowledged: null, canAcknowledge: false, busy: false, atTime: (s: string) => s }, global })
    const sources = w.findAll('.safety__sources li').map((li) => li.text())
    expect(sources).toHaveLength(CAUTIONS.length + 1)
    // The names as the standard and the rules print them: ASME PASE-2019, WAC 296-307-22509(3), 29 CFR 1910.244(a)(2).
    expect(sources[0]).toContain('ASME PASE-2019')
    expect(sources[1]).toContain('WAC 296-307-22509(3): "Working under a load raised only with jacks is prohibited."')
    expect(sources[1]).toContain('OSHA 29 CFR 1910.244(a)(2)')
    expect(sources[1]).toContain('de memoria')
    expect(sources[2]).toBe('Práctica de costumbre en el taller [S]')
    expect(sources[4]).toBe('Práctica común [S]; el torque es el que indica el fabricante')
    expect(sources[5]).toBe(`1 ft·lbf = ${NEWTON_METRES_PER_FOOT_POUND_FORCE} N·m exactos (0.3048 m × 4.4482216152605 N)`)
    for (const [i, c] of CAUTIONS.entries()) expect(sources[i], c.code).not.toBe(c.source)
  })

  it('in Spanish keeps every point: stands on firm level ground, never under a jack alone, chocks, lug nuts to the maker’s figure in a star, and the maker’s procedures', () => {
    i18n.global.locale.value = 'es'
    const w = mount(InspectionsSafety, { props: { acknowledged: null, canAcknowledge: false, busy: false, atTime: (s: string) => s }, global })
    const items = w.findAll('.safety__list li').map((li) => li.text())
    expect(items).toEqual([
      'Sostenga el vehículo levantado sobre torres (jack stands) de la capacidad indicada, en piso firme y nivelado.',
      'Nunca se meta debajo de un vehículo sostenido solo por un gato.',
      'Ponga calzas en las ruedas que quedan en el piso.',
      'Ponga el freno de mano.',
      'Después de volver a montar una rueda, apriete las tuercas al torque que indica el fabricante del vehículo, en estrella, en dos pasadas, con el vehículo ya bajado para la última pasada. Vuelva a revisarlas después de manejarlo (normalmente a las 50–100 millas).',
    ])
    expect(w.get('.safety__defer').text()).toBe('Estas son las precauciones de costumbre, no un procedimiento de reparación: siga los procedimientos del fabricante del vehículo y la práctica de su taller con licencia.')
  })
})
