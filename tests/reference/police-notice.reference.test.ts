import { describe, expect, it } from 'vitest'
import californiaJson from '../../server/rule-sets/samples/california.json' with { type: 'json' }
import floridaJson from '../../server/rule-sets/samples/florida.json' with { type: 'json' }
import { policeNoticeClock, type TowTimes } from '@shared/domain/clocks'
import { ruleSetSchema } from '@shared/schemas/rule-sets'

const california = ruleSetSchema.parse(californiaJson)
const florida = ruleSetSchema.parse(floridaJson)

// A private-property tow on Saturday 7 November 2026, Pacific standard time (UTC−8, a week after the clocks
// went back on 1 November): called 23:20, hooked 23:35, at the yard 23:58.
const tow: TowTimes = { reason: 'private_property', calledAt: '2026-11-07T23:20:00-08:00', hookedAt: '2026-11-07T23:35:00-08:00', arrivedAt: '2026-11-07T23:58:00-08:00' }

describe('police notification of a private-property tow, in hours from the tow', () => {
  it.each([
    // Cal. Veh. Code § 22658 [M — from memory]: within one hour after the tow is authorized; counted from the call.
    { name: 'California § 22658, from the call', rules: california, times: tow, due: '2026-11-08T08:20:00.000Z', start: 'called' },
    // The same with no call time recorded: the hook-up, the earliest time left, so never later than the law allows.
    { name: 'California § 22658, no call recorded: from the hook-up', rules: california, times: { ...tow, calledAt: null }, due: '2026-11-08T08:35:00.000Z', start: 'hooked' },
    // Fla. Stat. § 715.07(2)(a) [M — from memory]: within 30 minutes after completing the tow (arrival at storage).
    { name: 'Florida § 715.07, 30 minutes from the arrival', rules: florida, times: tow, due: '2026-11-08T08:28:00.000Z', start: 'arrived' },
  ])('policeNoticeClock_$name', ({ rules, times, due, start }) => {
    const clock = policeNoticeClock(rules.policeNotice, times, null, '2026-11-08T08:00:00Z')
    expect(clock).toMatchObject({ dueAt: due, start, status: 'open' })
  })

  // A clock in hours crosses midnight and the date line of the yard's calendar unchanged: 23:20 + 1 h = 00:20 the next day.
  it('policeNoticeClock_californiaCallAt2320_isDue0020TheNextDayLocal', () => {
    const clock = policeNoticeClock(california.policeNotice, tow, null, '2026-11-08T07:30:00Z')!
    expect(clock.dueAt).toBe('2026-11-08T08:20:00.000Z') // 00:20 PST on 8 November
    expect(clock.minutesLeft).toBe(50)
  })

  it.each([
    { at: '2026-11-08T08:20:00Z', status: 'met', why: 'told at the due minute itself' },
    { at: '2026-11-08T08:20:01Z', status: 'late', why: 'told a second after' },
  ])('policeNoticeClock_californiaToldAtTheEdge_is$status ($why)', ({ at, status }) => {
    const clock = policeNoticeClock(california.policeNotice, tow, { notifiedAt: at, agency: 'Riverton PD', person: null, reportNumber: null }, '2026-11-08T09:00:00Z')
    expect(clock?.status).toBe(status)
  })

  it('policeNoticeClock_nothingRecordedPastTheHour_isOverdue', () => {
    expect(policeNoticeClock(california.policeNotice, tow, null, '2026-11-08T08:21:00Z')).toMatchObject({ status: 'overdue', minutesLeft: -1 })
  })

  it.each(['breakdown', 'law_enforcement', 'owner_request'])('policeNoticeClock_%sTow_hasNoClock', (reason) => {
    expect(policeNoticeClock(california.policeNotice, { ...tow, reason }, null, '2026-11-08T08:00:00Z')).toBeNull()
  })

  it('policeNoticeClock_sampleRuleSets_citeTheirStatuteAndSayFromMemory', () => {
    expect(california.policeNotice?.source).toMatchObject({ citation: expect.stringContaining('22658'), confidence: 'M' })
    expect(florida.policeNotice?.source).toMatchObject({ citation: expect.stringContaining('715.07'), confidence: 'M' })
    for (const r of [california, florida]) expect(r.caution).toMatch(/^Sample — verify with your local code/)
  })
})
