// @vitest-environment happy-dom
import { QueryClient, VueQueryPlugin } from '@tanstack/vue-query'
import { mount } from '@vue/test-utils'
import { createPinia, setActivePinia } from 'pinia'
import { afterAll, afterEach, beforeAll, describe, expect, it, vi } from 'vitest'
import { defineComponent, h } from 'vue'
import { yardKeys } from '../../../src/api/yards'
import { calendarDate, useYardTime, yardFormat } from '../../../src/composables/yard-time'
import { useSessionStore } from '../../../src/stores/session'

// The browser (here the test process) is on the other side of the world from the yard. Offsets from
// the IANA time zone database: Pacific/Auckland is UTC+13 in December (NZDT); America/Los_Angeles is
// UTC−8 in December (PST; US daylight time ended on Sunday 1 Nov 2026) and UTC−7 in July (PDT).
// The zone's label is CLDR's short US name (en-US / es-US): PST in winter, PDT in summer, EST for New York in winter.
const BROWSER_ZONE = 'Pacific/Auckland'
const YARD_ZONE = 'America/Los_Angeles'
const EVENING_AT_THE_YARD = '2026-12-01T22:05:00Z' // 14:05 Tue 1 Dec at the yard; 11:05 Wed 2 Dec in Auckland
const NIGHT_AT_THE_YARD = '2026-12-01T03:00:00Z' // 19:00 Mon 30 Nov at the yard; 16:00 Tue 1 Dec in Auckland

const zoneBefore = process.env.TZ
beforeAll(() => {
  process.env.TZ = BROWSER_ZONE
})
afterAll(() => {
  process.env.TZ = zoneBefore
})
afterEach(() => vi.unstubAllGlobals())

/** Mounts a component showing `at` through useYardTime(zone), signed in as u1, with the query cache given. */
function show(at: string, client: QueryClient, zone?: () => string | undefined) {
  const pinia = createPinia()
  setActivePinia(pinia)
  useSessionStore().user = { id: 'u1', email: 'delia@yard.example', name: 'Delia', role: 'manager' }
  const Shown = defineComponent({
    setup() {
      const t = zone ? useYardTime(zone) : useYardTime()
      return () => h('p', [h('span', { class: 'date' }, t.date(at)), h('span', { class: 'date-time' }, t.dateTime(at)), h('span', { class: 'time' }, t.time(at))])
    },
  })
  return mount(Shown, { global: { plugins: [pinia, [VueQueryPlugin, { queryClient: client }]] } })
}

describe('yard time', () => {
  it('yardFormat_browserInAnotherZone_showsTheYardsClockNotTheBrowsers', () => {
    // The process really is in Auckland: a formatter left to itself would show Auckland's clock.
    expect(new Date(EVENING_AT_THE_YARD).getHours()).toBe(11)
    expect(new Intl.DateTimeFormat('en-GB', { hour: '2-digit', minute: '2-digit' }).format(new Date(EVENING_AT_THE_YARD))).toBe('11:05')

    const yard = yardFormat(YARD_ZONE)
    expect(yard.dateTime(EVENING_AT_THE_YARD)).toBe('1 Dec 2026, 14:05 PST')
    expect(yard.time(EVENING_AT_THE_YARD)).toBe('14:05 PST')
    expect(yard.date(NIGHT_AT_THE_YARD)).toBe('30 Nov 2026')
    expect(yard.dateTime('2026-07-04T18:30:00Z')).toBe('4 Jul 2026, 11:30 PDT')
  })

  it('yardFormat_nothingRecorded_showsADash', () => {
    expect(yardFormat(YARD_ZONE).dateTime(null)).toBe('—')
    expect(yardFormat(YARD_ZONE).date(undefined)).toBe('—')
  })

  it('calendarDate_aDayTheServerCounted_keepsItsDayInAnyZone', () => {
    expect(calendarDate('2026-12-30')).toBe('30 Dec 2026')
    expect(calendarDate('2026-01-01')).toBe('1 Jan 2026')
  })

  it('useYardTime_noZoneGiven_takesTheSignedInUsersYardZone', () => {
    const client = new QueryClient()
    client.setQueryData(yardKeys.current('u1'), { id: '5b0c1f7e-8a51-4f4e-9c1e-2f8a3b7d6e01', name: 'Tamsin Creek', code: 'TC', timeZone: YARD_ZONE })
    const w = show(NIGHT_AT_THE_YARD, client)
    expect(w.get('.date').text()).toBe('30 Nov 2026')
    expect(w.get('.date-time').text()).toBe('30 Nov 2026, 19:00 PST')
    expect(w.get('.time').text()).toBe('19:00 PST')
  })

  it('useYardTime_yardNotLoadedYet_showsNothingRatherThanTheBrowsersClock', () => {
    vi.stubGlobal('fetch', vi.fn(() => new Promise(() => {})))
    const w = show(EVENING_AT_THE_YARD, new QueryClient())
    expect(w.text()).toBe('')
    expect(fetch).toHaveBeenCalledWith('/api/yards/current', expect.objectContaining({ method: 'GET' }))
  })

  it('useYardTime_zoneOfTheRecordGiven_usesItAndAsksForNoOtherYard', () => {
    const fetch = vi.fn()
    vi.stubGlobal('fetch', fetch)
    const w = show(EVENING_AT_THE_YARD, new QueryClient(), () => 'America/New_York')
    // New York in December: UTC−5 (EST).
    expect(w.get('.date-time').text()).toBe('1 Dec 2026, 17:05 EST')
    expect(fetch).not.toHaveBeenCalled()
  })
})
