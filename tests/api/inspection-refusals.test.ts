import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { makeTestApp, type TestApp } from '../helpers/app'
import { acknowledged, inspectionCounts, line, put, teardownFixture, type Fixture } from '../helpers/inspection'

let app: TestApp
beforeAll(async () => {
  app = await makeTestApp()
})
afterAll(() => app.close())

type Send = (f: Fixture) => Promise<{ status: number; body: { error: string; issues?: { path: string; message: string }[] } }>

/** Sends the request and checks it is refused at the named field with nothing written, no file kept. */
async function refused(f: Fixture, send: Send, status: number, path: string, words: string) {
  const [before, onDisk] = [await inspectionCounts(app.db, f.vehicle.id), await app.storedKeys()]
  const res = await send(f)
  expect(res.status, JSON.stringify(res.body)).toBe(status)
  expect(res.body.issues?.map((i) => i.path)).toContain(path)
  expect(res.body.issues?.find((i) => i.path === path)?.message).toContain(words)
  expect(await inspectionCounts(app.db, f.vehicle.id)).toEqual(before)
  expect(await app.storedKeys()).toEqual(onDisk)
}

const values = { actualCashValueCents: 200_000, actualCashValueSource: 'Price guide', salvageValueCents: 30_000, salvageValueSource: 'Scrap weight' }

describe('bad estimate lines are refused at their field', () => {
  it.each([
    { why: 'a negative price', body: line({ unitPriceCents: -100 }), path: 'unitPriceCents', words: 'cannot be negative' },
    { why: 'a price in fractions of a cent', body: line({ unitPriceCents: 10.5 }), path: 'unitPriceCents', words: 'whole cents' },
    { why: 'a price over $50,000', body: line({ unitPriceCents: 5_000_001 }), path: 'unitPriceCents', words: '$50,000' },
    { why: 'hours over the 40-hour bound', body: line({ labourHours: 40.25 }), path: 'labourHours', words: 'more than 40' },
    { why: 'negative hours', body: line({ labourHours: -1 }), path: 'labourHours', words: 'cannot be negative' },
    { why: 'hours to three decimals', body: line({ labourHours: 1.333 }), path: 'labourHours', words: 'two decimals' },
    { why: 'no quantity', body: line({ quantity: 0 }), path: 'quantity', words: 'at least 1' },
    { why: 'no part named', body: line({ part: '   ' }), path: 'part', words: 'Say what the part' },
    { why: 'an item not on the checklist', body: line({ itemCode: 'flux-capacitor' }), path: 'itemCode', words: 'not an item' },
  ])('addLine with $why isRefused', async ({ body, path, words }) => {
    const f = await teardownFixture(app)
    await f.tech.post(f.base).expect(201)
    await refused(f, (x) => x.tech.post(`${x.base}/lines`, body), 400, path, words)
  })
})

describe('values out of range are refused at their field', () => {
  it.each([
    { why: 'a value of $0', body: { ...values, actualCashValueCents: 0 }, path: 'actualCashValueCents', words: 'more than $0' },
    { why: 'a negative salvage value', body: { ...values, salvageValueCents: -1 }, path: 'salvageValueCents', words: 'cannot be negative' },
    { why: 'a value over $1,000,000', body: { ...values, actualCashValueCents: 100_000_001 }, path: 'actualCashValueCents', words: '$1,000,000' },
    { why: 'salvage worth more than the vehicle', body: { ...values, salvageValueCents: 200_001 }, path: 'salvageValueCents', words: 'cannot be more than the vehicle' },
    { why: 'a value without its source', body: { ...values, actualCashValueSource: '' }, path: 'actualCashValueSource', words: 'where the value came from' },
  ])('setValues with $why isRefused', async ({ body, path, words }) => {
    const f = await teardownFixture(app, { estimatedValueCents: 123_400 })
    await f.tech.post(f.base).expect(201)
    await refused(f, (x) => put(x.tech, `${x.base}/values`, body), 400, path, words)
  })
})

describe('the finish and the pickup marks are refused until they may be made', () => {
  it('finish_withNoFindings_isRefusedNamingTheItems', async () => {
    const f = await teardownFixture(app)
    await acknowledged(f)
    await f.tech.patch(`${f.base}/roll-ability`, { rolls: true, steers: true, brakes: true }).expect(200)
    await refused(f, (x) => x.tech.post(`${x.base}/finish`), 422, 'items', 'No findings yet')
  })

  it('finish_onlyNotCheckedMarks_countsAsNoFindings', async () => {
    const f = await teardownFixture(app)
    await acknowledged(f)
    await put(f.tech, `${f.base}/items/engine`, { status: 'not_checked', note: 'Battery flat, could not start it' }).expect(200)
    await f.tech.patch(`${f.base}/roll-ability`, { rolls: true, steers: true, brakes: true }).expect(200)
    await refused(f, (x) => x.tech.post(`${x.base}/finish`), 422, 'items', 'No findings yet')
  })

  it('finish_withoutTheSafetyAcknowledgementOrTheRollMarks_givesEveryReason', async () => {
    const f = await teardownFixture(app)
    await f.tech.post(f.base).expect(201)
    await put(f.tech, `${f.base}/items/tyres`, { status: 'worn' }).expect(200)
    await refused(f, (x) => x.tech.post(`${x.base}/finish`), 422, 'safety', 'safety cautions')
    const res = await f.tech.post(`${f.base}/finish`)
    expect(res.body.issues.map((i: { path: string }) => i.path)).toEqual(['safety', 'rolls', 'steers', 'brakes'])
  })

  it('markRolls_beforeTheSafetyAcknowledgement_isRefused', async () => {
    const f = await teardownFixture(app)
    await f.tech.post(f.base).expect(201)
    await refused(f, (x) => x.tech.patch(`${x.base}/roll-ability`, { rolls: false }), 422, 'safety', 'safety cautions')
  })

  it.each([
    { why: 'a refitted wheel with no torque figure', body: { rolls: true, wheelRefitted: true }, path: 'lugTorqueFtLbf', words: "maker's lug-nut torque" },
    { why: 'a torque no maker gives', body: { wheelRefitted: true, lugTorqueFtLbf: 5 }, path: 'lugTorqueFtLbf', words: 'not a real figure' },
    { why: 'nothing at all', body: {}, path: '(body)', words: 'Nothing to save' },
    { why: 'a yes-or-no sent as text', body: { rolls: 'no' }, path: 'rolls', words: 'does it roll?' },
  ])('markRolls with $why isRefused', async ({ body, path, words }) => {
    const f = await teardownFixture(app)
    await acknowledged(f)
    await refused(f, (x) => x.tech.patch(`${x.base}/roll-ability`, body), 400, path, words)
  })

  it('aFinding_withAStatusNotOnTheList_isRefused', async () => {
    const f = await teardownFixture(app)
    await f.tech.post(f.base).expect(201)
    await refused(f, (x) => put(x.tech, `${x.base}/items/tyres`, { status: 'bald' }), 400, 'status', 'OK, worn, broken')
  })

  it('aPhoto_thatIsNotAnImage_isRefusedAndNoFileIsKept', async () => {
    const f = await teardownFixture(app)
    await f.tech.post(f.base).expect(201)
    const send: Send = (x) =>
      x.tech.agent
        .post(`${x.base}/items/tyres/photos`)
        .set('x-csrf-token', x.tech.csrf)
        .attach('files', Buffer.from('%!PS-Adobe-3.0 not a photo at all'), { filename: 'tyre.jpg', contentType: 'image/jpeg' })
    await refused(f, send, 400, 'files.0', 'whatever its name says')
  })

  it('findings_withNoInspectionStarted_areRefusedWithWhatToDo', async () => {
    const f = await teardownFixture(app)
    const res = await put(f.tech, `${f.base}/items/tyres`, { status: 'ok' })
    expect(res.status).toBe(409)
    expect(res.body.error).toContain('Start the inspection first')
    expect(await inspectionCounts(app.db, f.vehicle.id)).toMatchObject({ inspections: 0, items: 0, history: 0 })
  })
})
