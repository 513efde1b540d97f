// @vitest-environment happy-dom
import { mount } from '@vue/test-utils'
import { afterEach, beforeAll, describe, expect, it, vi } from 'vitest'
import type { PoliceNoticeClockView } from '@shared/schemas/police-notices'
import { i18n, loadMessages } from '@/i18n'
import ClocksEligible from '../../../src/components/clocks/ClocksEligible.vue'
import PoliceNoticeBadge from '../../../src/components/police/PoliceNoticeBadge.vue'
import { withI18n } from '../../helpers/i18n'

beforeAll(() => Promise.all([loadMessages('en'), loadMessages('es')]))
afterEach(() => {
  vi.useRealTimers()
  i18n.global.locale.value = 'en'
})

const NOW = new Date('2026-12-02T20:00:00Z')
const clock = (dueAt: string): PoliceNoticeClockView => ({
  label: 'Tell the local traffic law enforcement agency of the private-property tow',
  status: 'open',
  hours: 1,
  start: 'called',
  startAt: '2026-12-02T19:20:00.000Z',
  dueAt,
  minutesLeft: 0,
  explanation: '1 hour after the call.',
  source: { citation: 'Cal. Veh. Code § 22658', confidence: 'M' },
  placeholder: false,
  notification: null,
})

describe('PoliceNoticeBadge', () => {
  it.each([
    { due: '2026-12-02T20:40:00.000Z', words: 'Tell the police · 40 min left', late: false },
    { due: '2026-12-02T19:45:00.000Z', words: 'Police not told · 15 min overdue', late: true },
    { due: '2026-12-02T14:00:00.000Z', words: 'Police not told · 6 h overdue', late: true },
    { due: '2026-11-29T20:00:00.000Z', words: 'Police not told · 3 d overdue', late: true },
  ])('policeBadge_runningClock_saysTheTimeInWords ($words)', ({ due, words, late }) => {
    vi.useFakeTimers({ now: NOW })
    const wrapper = mount(PoliceNoticeBadge, { props: { clock: clock(due) }, global: { plugins: [withI18n()] } })
    expect(wrapper.text()).toBe(words)
    expect(wrapper.classes('police-badge--late')).toBe(late)
    expect(wrapper.attributes('title')).toContain('22658')
  })

  it('policeBadge_inSpanish_readsAsAClerkSaysIt', () => {
    vi.useFakeTimers({ now: NOW })
    const wrapper = mount(PoliceNoticeBadge, { props: { clock: clock('2026-12-02T20:40:00.000Z') }, global: { plugins: [withI18n('es')] } })
    expect(wrapper.text()).toBe('Avisar a la policía · quedan 40 min')
  })
})

describe('ClocksEligible', () => {
  const eligible = { since: '2026-08-04', step: 'Earliest lien sale', citation: 'Fla. Stat. § 713.78' }

  it('clocksEligible_short_isAWordAndADateWithTheRuleOnHover', () => {
    const wrapper = mount(ClocksEligible, { props: { eligible, short: true }, global: { plugins: [withI18n()] } })
    expect(wrapper.text()).toBe('Eligible for sale since 4 Aug 2026')
    expect(wrapper.attributes('title')).toBe('Earliest lien sale (Fla. Stat. § 713.78)')
  })

  it('clocksEligible_full_namesTheRuleAndCitation', () => {
    const wrapper = mount(ClocksEligible, { props: { eligible }, global: { plugins: [withI18n()] } })
    expect(wrapper.text()).toContain('Eligible for lien sale or disposal since 4 Aug 2026')
    expect(wrapper.text()).toContain('Earliest lien sale — Fla. Stat. § 713.78')
  })
})
