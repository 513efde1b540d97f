import request from 'supertest'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { isoDate, localDay } from '@shared/domain/time'
import { makeTestApp, signedIn, type TestApp } from '../helpers/app'
import { DAY, sampleVersion } from '../helpers/board'
import { makeStaff, makeVehicle } from '../helpers/factories'

// Issue 10: the owner's page explains every deadline that concerns the owner. It counted them from the arrival
// alone, so a step the office had met (the records request) still read "coming up" there while the office's
// pages said "met". It now counts as they do, from what the office recorded.
let app: TestApp
beforeAll(async () => {
  app = await makeTestApp()
})
afterAll(() => app.close())

describe("the owner's page deadlines", () => {
  it('show the records request as met once the office has recorded it, as the office sees it', async () => {
    const staff = await makeStaff(app.db)
    // California sample, a $450 vehicle (the low-value branch), stored two days ago.
    const v = await makeVehicle(app.db, staff.yard.id, { state: 'storage', ruleSetVersionId: await sampleVersion(app.db, 'california-sample'), estimatedValueCents: 45_000, arrivedAt: new Date(Date.now() - 2 * DAY) })
    const office = await signedIn(app.app, staff.office)
    const link = (await office.post(`/api/vehicles/${v.id}/owner-links`).expect(201)).body
    const recordsStep = async () => ((await request(app.app).get(`/api/owner/${link.token}`).expect(200)).body.deadlines as { code: string; status: string; dueDate: string | null }[]).find((d) => d.code === 'records-request')!

    // Cal. Civ. Code § 3072 (as the sample cites it): request the owner records within 15 days of the lien arising.
    expect(await recordsStep()).toMatchObject({ status: 'upcoming' })
    const today = isoDate(localDay(staff.yard.timeZone, Date.now()))
    const sent = await office.post(`/api/vehicles/${v.id}/records-requests`, { agency: 'California DMV', sentOn: today })
    expect(sent.status, JSON.stringify(sent.body)).toBe(201)
    expect(sent.body.recordsDeadline.status).toBe('met')
    expect(await recordsStep()).toMatchObject({ status: 'met' })
  })
})
