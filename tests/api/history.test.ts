import { readdirSync, readFileSync } from 'node:fs'
import path from 'node:path'
import { eq, sql } from 'drizzle-orm'
import { afterAll, beforeAll, beforeEach, describe, expect, it } from 'vitest'
import * as t from '@db/schema'
import { makeTestApp, signedIn, type BrowserSession, type TestApp } from '../helpers/app'
import { makeStaff } from '../helpers/factories'
import { towInBody } from '../helpers/tow-in'

let app: TestApp
let staff: Awaited<ReturnType<typeof makeStaff>>
let d: BrowserSession
let id: string
beforeAll(async () => {
  app = await makeTestApp()
})
afterAll(() => app.close())
beforeEach(async () => {
  staff = await makeStaff(app.db)
  d = await signedIn(app.app, staff.dispatcher)
  id = (await d.post('/api/vehicles', towInBody(staff.dispatcher.id, (b) => (b.holds = [{ kind: 'dispute', note: 'Owner called' }]))).expect(201)).body.id
})

const verify = async () => (await d.get(`/api/vehicles/${id}/history/verify`).expect(200)).body

/** Every TypeScript file under a folder of the project. */
function sources(dir: string): string[] {
  return readdirSync(dir, { recursive: true, withFileTypes: true })
    .filter((e) => e.isFile() && e.name.endsWith('.ts'))
    .map((e) => path.join(e.parentPath, e.name))
}

describe('the chain of custody', () => {
  it('an untouched history verifies', async () => {
    expect(await verify()).toEqual({ ok: true, events: 2 })
  })

  it('the database refuses to change or remove a history row', async () => {
    await expect(app.db.update(t.historyEvents).set({ reason: 'rewritten' }).where(eq(t.historyEvents.vehicleId, id))).rejects.toThrow()
    await expect(app.db.delete(t.historyEvents).where(eq(t.historyEvents.vehicleId, id))).rejects.toThrow()
    expect(await app.db.$count(t.historyEvents, eq(t.historyEvents.vehicleId, id))).toBe(2)
  })

  it('no code in the server or the database layer updates or deletes history', () => {
    const root = path.resolve(import.meta.dirname, '../..')
    const offenders = [...sources(path.join(root, 'server')), ...sources(path.join(root, 'db'))].filter((file) =>
      /\.(update|delete)\(\s*(t\.)?historyEvents\b|(update|delete\s+from)\s+"?history_events/i.test(readFileSync(file, 'utf8')),
    )
    expect(offenders).toEqual([])
  })

  it('a row changed behind the app’s back is found, with the event that broke', async () => {
    // Only a superuser who switches the trigger off can do this; the hash chain still tells.
    await app.db.execute(sql`alter table history_events disable trigger history_events_append_only`)
    await app.db.execute(sql`update history_events set after = '{"kind":"lien"}' where vehicle_id = ${id} and seq = 2`)
    await app.db.execute(sql`alter table history_events enable trigger history_events_append_only`)
    expect(await verify()).toEqual({ ok: false, events: 2, brokenAt: { seq: 2, reason: 'its content was changed after it was written' } })
  })

  it('a removed row is found too', async () => {
    await d.post(`/api/vehicles/${id}/holds`, { kind: 'other', note: 'Insurer asked to wait' }).expect(201)
    await app.db.execute(sql`alter table history_events disable trigger history_events_append_only`)
    await app.db.execute(sql`delete from history_events where vehicle_id = ${id} and seq = 2`)
    await app.db.execute(sql`alter table history_events enable trigger history_events_append_only`)
    expect((await verify()).brokenAt).toEqual({ seq: 3, reason: 'an event is missing before this one' })
  })
})
