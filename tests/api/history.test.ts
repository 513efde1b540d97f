import { randomBytes } from 'node:crypto'
import { mkdtempSync, readdirSync, readFileSync, statSync, writeFileSync } from 'node:fs'
import { tmpdir } from 'node:os'
import path from 'node:path'
import { eq, sql } from 'drizzle-orm'
import { afterAll, beforeAll, beforeEach, describe, expect, it } from 'vitest'
import { eventHash, headSeal, historyOf } from '@db/history'
import * as t from '@db/schema'
import { loadHistoryKey } from '../../server/history-key'
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
    expect(await verify()).toEqual({ ok: true, events: 2, problems: [] })
  })

  it('the database refuses to change or remove a history row', async () => {
    await expect(app.db.update(t.historyEvents).set({ reason: 'rewritten' }).where(eq(t.historyEvents.vehicleId, id))).rejects.toThrow()
    await expect(app.db.delete(t.historyEvents).where(eq(t.historyEvents.vehicleId, id))).rejects.toThrow()
    expect(await app.db.$count(t.historyEvents, eq(t.historyEvents.vehicleId, id))).toBe(2)
  })

  it('no code in the server or the database layer updates or deletes history', () => {
    const root = path.resolve(import.meta.dirname, '../..')
    // The one exception: a data directory just made from the build's demo template re-seals the demo's
    // history with the install's own key, once, before anything is served (tests/api/demo-template.test.ts).
    const resealsTheDemoTemplate = path.join(root, 'server/demo/template.ts')
    const offenders = [...sources(path.join(root, 'server')), ...sources(path.join(root, 'db'))].filter(
      (file) => file !== resealsTheDemoTemplate && /\.(update|delete)\(\s*(t\.)?historyEvents\b|(update|delete\s+from)\s+"?history_events/i.test(readFileSync(file, 'utf8')),
    )
    expect(offenders).toEqual([])
  })

  it('a row changed behind the app’s back is found, with the event that broke', async () => {
    // Only a superuser who switches the trigger off can do this; the hash chain still tells.
    await app.db.execute(sql`alter table history_events disable trigger history_events_append_only`)
    await app.db.execute(sql`update history_events set after = '{"kind":"lien"}' where vehicle_id = ${id} and seq = 2`)
    await app.db.execute(sql`alter table history_events enable trigger history_events_append_only`)
    expect(await verify()).toMatchObject({ ok: false, events: 2, brokenAt: { seq: 2, reason: 'its content was changed after it was written, or it was not written by Holdfast' } })
  })

  it('a removed row is found too', async () => {
    await d.post(`/api/vehicles/${id}/holds`, { kind: 'other', note: 'Insurer asked to wait' }).expect(201)
    await app.db.execute(sql`alter table history_events disable trigger history_events_append_only`)
    await app.db.execute(sql`delete from history_events where vehicle_id = ${id} and seq = 2`)
    await app.db.execute(sql`alter table history_events enable trigger history_events_append_only`)
    expect((await verify()).brokenAt).toEqual({ seq: 3, reason: 'an event is missing before this one' })
  })
})

// The attacker of issue 13: the database's own administrator, with the server stopped and the
// append-only trigger off, who knows how the chain is computed but not the key kept outside the database.
async function asSuperuser(work: () => Promise<unknown>) {
  await app.db.execute(sql`alter table history_events disable trigger history_events_append_only`)
  try {
    await work()
  } finally {
    await app.db.execute(sql`alter table history_events enable trigger history_events_append_only`)
  }
}

/** Rewrites every hash and link of the vehicle's chain from the first event, with a key of the attacker's own. */
async function rehash(key: Buffer) {
  let prev = '0'.repeat(64)
  for (const row of await historyOf(app.db, id)) {
    const hash = eventHash(key, prev, row)
    await app.db.execute(sql`update history_events set prev_hash = ${prev}, hash = ${hash} where id = ${row.id}`)
    prev = hash
  }
  return prev
}

describe('the chain of custody against the database administrator (issue 13, item 1)', () => {
  it('an edited event with every hash recomputed is found: the links are keyed with a secret outside the database', async () => {
    await asSuperuser(async () => {
      await app.db.execute(sql`update history_events set reason = 'Released to the owner' where vehicle_id = ${id} and seq = 2`)
      await rehash(randomBytes(32))
    })
    expect(await verify()).toMatchObject({ ok: false, brokenAt: { seq: 1 } })
  })

  it('removing the newest event is found from the sealed head', async () => {
    await d.post(`/api/vehicles/${id}/holds`, { kind: 'other', note: 'Insurer asked to wait' }).expect(201)
    await asSuperuser(() => app.db.execute(sql`delete from history_events where vehicle_id = ${id} and seq = 3`))
    expect(await verify()).toEqual({ ok: false, events: 2, problems: ['events 3 to 3 were removed'] })
  })

  it('removing a vehicle’s whole history is found, with or without its head', async () => {
    await asSuperuser(() => app.db.execute(sql`delete from history_events where vehicle_id = ${id}`))
    expect((await verify()).problems).toEqual(['the history is empty, but 2 events were written'])
    await app.db.delete(t.historyHeads).where(eq(t.historyHeads.vehicleId, id))
    expect((await verify()).problems).toEqual(['the history has no sealed head: it was removed, or never written by Holdfast'])
  })

  it('a head rewritten to point at an earlier event is found: its seal needs the key', async () => {
    await d.post(`/api/vehicles/${id}/holds`, { kind: 'other', note: 'Insurer asked to wait' }).expect(201)
    const [second] = (await historyOf(app.db, id)).filter((e) => e.seq === 2)
    await asSuperuser(() => app.db.execute(sql`delete from history_events where vehicle_id = ${id} and seq = 3`))
    const forged = headSeal(randomBytes(32), id, 2, second!.hash)
    await app.db.update(t.historyHeads).set({ seq: 2, hash: second!.hash, seal: forged }).where(eq(t.historyHeads.vehicleId, id))
    expect((await verify()).problems).toEqual(['the sealed head was altered'])
  })

  it('a vehicle whose state was changed without a move in its history is found', async () => {
    await app.db.update(t.vehicles).set({ state: 'release' }).where(eq(t.vehicles.id, id))
    expect((await verify()).problems).toEqual(['the vehicle is in release, but its history last moved it to arrival'])
  })
})

describe('the history key file', () => {
  const dir = () => mkdtempSync(path.join(tmpdir(), 'holdfast-key-'))

  it('a new install makes a 256-bit key readable by its owner only, and reads the same key next time', () => {
    const file = path.join(dir(), 'data.history-key')
    const key = loadHistoryKey(file, false)
    expect(key).toHaveLength(32)
    expect(statSync(file).mode & 0o777).toBe(0o600)
    expect(loadHistoryKey(file, true).equals(key)).toBe(true)
  })

  it('a missing key with history in the database stops the start, saying what to restore', () => {
    expect(() => loadHistoryKey(path.join(dir(), 'gone'), true)).toThrow(/history key .* is missing.*Restore the file/)
  })

  it('a key file that is not 64 hexadecimal digits stops the start', () => {
    const file = path.join(dir(), 'bad')
    writeFileSync(file, 'not a key\n')
    expect(() => loadHistoryKey(file, false)).toThrow(/64 hexadecimal digits/)
  })
})
