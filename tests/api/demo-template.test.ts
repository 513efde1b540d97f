// The demo built into the database template at `npm run build` is sealed with a throw-away build key;
// its first start seals it again with the install's own key (server/demo/template.ts). Here a demo is
// sealed with a "build" key, adopted with a new key, and checked against both.
import { mkdtempSync, readFileSync, writeFileSync } from 'node:fs'
import { randomBytes } from 'node:crypto'
import { tmpdir } from 'node:os'
import path from 'node:path'
import { sql } from 'drizzle-orm'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { verifyVehicleHistory } from '@db/history'
import * as t from '@db/schema'
import { localFileStore } from '../../server/files/index'
import { adoptDemoTemplate, loadDemoIfEmpty, usableDemoTemplate, type DemoTemplateMeta } from '../../server/demo/index'
import { DEMO_PASSWORD } from '../../server/demo/scenario'
import { makeTestApp, signedIn, type TestApp } from '../helpers/app'

const BUILD_KEY = randomBytes(32)
const INSTALL_KEY = randomBytes(32)

let app: TestApp
let vehicleIds: string[]
let tokensBefore: string[]
let adopted: Awaited<ReturnType<typeof adoptDemoTemplate>>
const filesDir = mkdtempSync(path.join(tmpdir(), 'holdfast-demo-template-'))
const shipped = Buffer.from('%PDF-1.7 a demo letter')

const tokenHashes = async () =>
  [...(await app.db.select({ h: t.ownerLinks.tokenHash }).from(t.ownerLinks)), ...(await app.db.select({ h: t.gatePasses.tokenHash }).from(t.gatePasses))].map((r) => r.h)

beforeAll(async () => {
  app = await makeTestApp({ historyKey: INSTALL_KEY })
  await loadDemoIfEmpty(app.db, BUILD_KEY)
  vehicleIds = (await app.db.select({ id: t.vehicles.id }).from(t.vehicles)).map((v) => v.id)
  tokensBefore = await tokenHashes()
  const meta: DemoTemplateMeta = { builtAt: new Date().toISOString(), files: [{ key: 'demo/letter.pdf', data: shipped.toString('base64') }] }
  adopted = await adoptDemoTemplate(app.db, INSTALL_KEY, localFileStore(filesDir), meta)
}, 180_000)
afterAll(() => app.close())

describe('a database made from the demo template', () => {
  it('re-seals every chain and head: the build key no longer verifies, the install key does', async () => {
    expect(vehicleIds.length).toBeGreaterThan(20)
    expect(adopted.resealed.vehicles).toBe(vehicleIds.length)
    for (const id of vehicleIds) {
      const withInstall = await verifyVehicleHistory(app.db, INSTALL_KEY, id)
      expect(withInstall.problems, id).toEqual([])
      const withBuild = await verifyVehicleHistory(app.db, BUILD_KEY, id)
      expect(withBuild.ok, id).toBe(false)
      expect(withBuild.brokenAt?.seq).toBe(1)
    }
    const events = await app.db.select({ id: t.historyEvents.id }).from(t.historyEvents)
    expect(adopted.resealed.events).toBe(events.length)
  })

  it('the server built with the install key shows each chain as verified', async () => {
    const office = await signedIn(app.app, { email: 'priya@tamsincreek.example', password: DEMO_PASSWORD })
    const res = await office.get(`/api/vehicles/${vehicleIds[0]}/history/verify`)
    expect(res.status).toBe(200)
    expect(res.body.ok).toBe(true)
  })

  it('keeps the history append-only once re-sealed', async () => {
    const refused = await app.db.execute(sql`update history_events set reason = 'rewritten' where vehicle_id = ${vehicleIds[0]}`).then(() => null, (err: Error) => err)
    expect(String((refused?.cause as Error | undefined)?.message)).toMatch(/history_events is append-only: UPDATE refused/)
  })

  it('replaces every token the build made, so none that shipped opens anything', async () => {
    const after = await tokenHashes()
    expect(tokensBefore.length).toBeGreaterThan(0)
    expect(after).toHaveLength(tokensBefore.length)
    for (const h of after) expect(tokensBefore).not.toContain(h)
  })

  it("puts the template's files into the install's store", () => {
    expect(readFileSync(path.join(filesDir, 'demo', 'letter.pdf'))).toEqual(shipped)
  })
})

describe('which template a new install starts from', () => {
  const meta = (builtAt: Date) => {
    const file = path.join(mkdtempSync(path.join(tmpdir(), 'holdfast-demo-meta-')), 'demo.json')
    writeFileSync(file, JSON.stringify({ builtAt: builtAt.toISOString(), files: [] }))
    return file
  }
  const now = new Date('2026-03-10T12:00:00Z')

  it('the demo template while its demo is under a day old', () => {
    expect(usableDemoTemplate(meta(new Date('2026-03-10T02:00:00Z')), now)?.builtAt).toBe('2026-03-10T02:00:00.000Z')
  })

  it('not an older one (its demo would end days ago), nor a missing one: the demo is then played at the start', () => {
    expect(usableDemoTemplate(meta(new Date('2026-03-09T11:00:00Z')), now)).toBeNull()
    expect(usableDemoTemplate(path.join(tmpdir(), 'no-such-demo-template.json'), now)).toBeNull()
  })
})
