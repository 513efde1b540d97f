import { readFileSync } from 'node:fs'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { loadSampleRuleSets } from '../../server/rule-sets/index'
import { usFederalHolidays } from '../helpers/us-federal-holidays'
import { makeTestApp, signedIn, type TestApp } from '../helpers/app'
import { makeStaff } from '../helpers/factories'

let t: TestApp
beforeAll(async () => {
  t = await makeTestApp()
  await loadSampleRuleSets(t.db)
})
afterAll(() => t.close())

const california = JSON.parse(readFileSync('server/rule-sets/samples/california.json', 'utf8'))

describe('rule sets and quotes API', () => {
  it('GET /api/rule-sets lists the shipped samples with their caution', async () => {
    const staff = await makeStaff(t.db)
    const s = await signedIn(t.app, staff.technician)
    const res = await s.get('/api/rule-sets').expect(200)
    const ids = res.body.ruleSets.map((r: { id: string }) => r.id)
    expect(ids).toEqual(expect.arrayContaining(['california-sample', 'florida-sample']))
    for (const r of res.body.ruleSets) expect(r.caution).toMatch(/verify with your local code/i)
  })

  it('GET /api/rule-sets/:id answers the rule set body as shipped', async () => {
    const staff = await makeStaff(t.db)
    const s = await signedIn(t.app, staff.office)
    const res = await s.get('/api/rule-sets/california-sample').expect(200)
    expect(res.body.ruleSet.storage.counting.method).toBe(california.storage.counting.method)
    expect((await s.get('/api/rule-sets/atlantis')).status).toBe(404)
  })

  // Cal. Civ. Code § 3068.1(a)(1): released 24 hours or less after storage → no more than one day.
  it('POST /api/quotes/storage bills 23 h 59 min in California as one day', async () => {
    const staff = await makeStaff(t.db)
    const s = await signedIn(t.app, staff.dispatcher)
    const res = await s.post('/api/quotes/storage', {
      ruleSetId: 'california-sample',
      stay: { arrivedAt: '2026-03-02T09:00:00-08:00', releasedAt: '2026-03-03T08:59:00-08:00', vehicleClass: 'standard' },
      asOf: '2026-03-04T12:00:00-08:00',
    })
    expect(res.status).toBe(200)
    expect(res.body.bill.days).toBe(1)
    const daily = california.vehicleClasses.find((c: { code: string }) => c.code === 'standard').dailyRateCents
    expect(res.body.bill.lines[0].amountCents).toBe(daily)
  })

  it('POST /api/quotes/storage with a release before arrival answers 400 naming releasedAt', async () => {
    const staff = await makeStaff(t.db)
    const s = await signedIn(t.app, staff.office)
    const res = await s.post('/api/quotes/storage', {
      ruleSetId: 'california-sample',
      stay: { arrivedAt: '2026-03-02T09:00:00-08:00', releasedAt: '2026-03-01T09:00:00-08:00', vehicleClass: 'standard' },
      asOf: '2026-03-04T12:00:00-08:00',
    })
    expect(res.status).toBe(400)
    expect(res.body.issues[0].path).toBe('releasedAt')
  })

  it('POST /api/quotes/storage with a malformed instant answers 400 naming the field', async () => {
    const staff = await makeStaff(t.db)
    const s = await signedIn(t.app, staff.office)
    const res = await s.post('/api/quotes/storage', { ruleSetId: 'california-sample', stay: { arrivedAt: 'yesterday', vehicleClass: 'standard' }, asOf: '2026-03-04T12:00:00Z' })
    expect(res.status).toBe(400)
    expect(res.body.issues.map((i: { path: string }) => i.path)).toContain('stay.arrivedAt')
  })

  // Fla. Stat. 713.78 [S]: notice of lien within 7 business days of storage. Observed holidays by
  // 5 U.S.C. 6103 and OPM's weekend rule [C]:
  // - stored Wed 1 Jul 2026; Independence Day (Sat 4 Jul) is observed Fri 3 Jul → due Mon 13 Jul 2026;
  // - stored Wed 1 Nov 2028; Veterans Day (Sat 11 Nov) is observed Fri 10 Nov → due Mon 13 Nov 2028.
  //   date-holidays types that substitute as a bank holiday, not a public one.
  it.each([
    { holiday: 'Independence Day', stored: '2026-07-01T10:00:00-04:00', observed: '2026-07-03', due: '2026-07-13' },
    { holiday: 'Veterans Day', stored: '2028-11-01T10:00:00-04:00', observed: '2028-11-10', due: '2028-11-13' },
  ])('POST /api/quotes/clocks skips the observed $holiday in Florida business days', async ({ stored, observed, due }) => {
    const staff = await makeStaff(t.db)
    const s = await signedIn(t.app, staff.office)
    const res = await s.post('/api/quotes/clocks', {
      ruleSetId: 'florida-sample',
      vehicle: { modelYear: 2015 },
      events: [{ kind: 'stored', at: stored }],
      asOf: new Date(Date.parse(stored) + 86_400_000).toISOString(),
    })
    expect(res.status).toBe(200)
    const notice = res.body.clocks.deadlines.find((d: { code: string }) => d.code === 'notice-of-lien')
    expect(notice.dueDate).toBe(due)
    expect(notice.holidaysSkipped.map((h: { date: string }) => h.date)).toContain(observed)
  })

  // Fla. Stat. 713.78(4) [S]: notice of lien within 7 business days of storage; the section does not say
  // which holidays close a business day [M], so the sample skips a day only when both the Florida and the
  // federal calendar close it, and a mailing due on a day post offices are closed moves earlier [C]:
  // - stored Fri 20 Nov 2026: Fri 27 Nov (Florida's Day After Thanksgiving, federal offices open) counts → Wed 2 Dec;
  // - stored Thu 1 Oct 2026: the 7th business day is Mon 12 Oct, Columbus Day (5 U.S.C. 6103 [V]), when post
  //   offices are closed → Fri 9 Oct.
  it.each([
    { why: 'counts the Day After Thanksgiving', stored: '2026-11-20T10:00:00-05:00', due: '2026-12-02' },
    { why: 'moves a mailing due on Columbus Day earlier', stored: '2026-10-01T10:00:00-04:00', due: '2026-10-09' },
  ])('POST /api/quotes/clocks in Florida $why', async ({ stored, due }) => {
    const staff = await makeStaff(t.db)
    const s = await signedIn(t.app, staff.office)
    const res = await s.post('/api/quotes/clocks', { ruleSetId: 'florida-sample', vehicle: { modelYear: 2015 }, events: [{ kind: 'stored', at: stored }], asOf: stored })
    expect(res.status).toBe(200)
    expect(res.body.clocks.deadlines.find((d: { code: string }) => d.code === 'notice-of-lien').dueDate).toBe(due)
  })

  // The federal template's calendar, on weekdays, is exactly the days federal holidays are observed on
  // (5 U.S.C. 6103 with OPM's weekend rule, computed independently in tests/helpers/us-federal-holidays.ts).
  it('GET /api/rule-sets/ordinance-24h-template/holidays is the observed federal holidays, 2021 to 2030', async () => {
    const staff = await makeStaff(t.db)
    const s = await signedIn(t.app, staff.office)
    const res = await s.get('/api/rule-sets/ordinance-24h-template/holidays?from=2021&to=2030').expect(200)
    const federal = Array.from({ length: 10 }, (_, i) => usFederalHolidays(2021 + i)).flat().map((h) => h.date)
    // The calendar also names the weekend day itself; business days skip that anyway.
    const weekday = (d: string) => ![0, 6].includes(new Date(`${d}T12:00:00Z`).getUTCDay())
    expect(res.body.holidays.map((h: { date: string }) => h.date).filter(weekday).sort()).toEqual(federal.sort())
  })

  // State calendars keep their own list (neither state closes for Columbus Day), but each moves its
  // weekend holidays by the same rule: REFERENCES.md's check dates [C].
  it.each(['florida-sample', 'california-sample'])('GET /api/rule-sets/%s/holidays has the weekday each weekend holiday is observed on', async (id) => {
    const staff = await makeStaff(t.db)
    const s = await signedIn(t.app, staff.office)
    const res = await s.get(`/api/rule-sets/${id}/holidays?from=2026&to=2029`).expect(200)
    const dates = res.body.holidays.map((h: { date: string }) => h.date)
    expect(dates).toEqual(expect.arrayContaining(['2026-07-03', '2027-07-05', '2027-12-24', '2027-12-31', '2028-11-10', '2029-11-12']))
  })

  it('GET /api/rule-sets/:id/holidays refuses more than ten years', async () => {
    const staff = await makeStaff(t.db)
    const s = await signedIn(t.app, staff.office)
    expect((await s.get('/api/rule-sets/florida-sample/holidays?from=2020&to=2040')).status).toBe(400)
    const ok = await s.get('/api/rule-sets/florida-sample/holidays?from=2026&to=2026').expect(200)
    expect(ok.body.holidays.map((h: { name: string }) => h.name)).toContain('Juneteenth')
  })
})
