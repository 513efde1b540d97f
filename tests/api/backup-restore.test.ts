import { randomBytes } from 'node:crypto'
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs'
import { tmpdir } from 'node:os'
import path from 'node:path'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { makeBackup, readManifest, restoreBackup, tableStats, companyCheckpoints } from '../../server/backup/backup'
import { makeTestApp, signedIn, TEST_HISTORY_KEY, type TestApp } from '../helpers/app'
import { billedVehicle, key } from '../helpers/billing'
import { vehicleRow } from '../helpers/board'
import { makeStaff } from '../helpers/factories'
import { photo, towInBody } from '../helpers/tow-in'

// Issue 13, "Backup and restore": a logical dump restored into a fresh database equals the original.
let yard: TestApp
let backupDir: string
let first: { manager: { email: string; password: string }; vehicleId: string } | undefined
const scratch = mkdtempSync(path.join(tmpdir(), 'holdfast-backup-test-'))
afterAll(async () => {
  await yard?.close()
  rmSync(scratch, { recursive: true, force: true })
})

beforeAll(async () => {
  yard = await makeTestApp()
  // A yard with a bit of everything: two companies, tow-ins with photos, a document, moves, a payment.
  for (const name of ['North', 'South']) {
    const staff = await makeStaff(yard.db)
    const d = await signedIn(yard.app, staff.dispatcher)
    const towed = await d.agent.post('/api/vehicles').set('x-csrf-token', d.csrf).field('data', JSON.stringify(towInBody(staff.dispatcher.id))).attach('photos', await photo(), `${name}.jpg`)
    expect(towed.status, JSON.stringify(towed.body)).toBe(201)
    const { PDFDocument } = await import('pdf-lib')
    const pdf = await PDFDocument.create()
    pdf.addPage([200, 200])
    await d.agent.post(`/api/vehicles/${towed.body.id}/files`).set('x-csrf-token', d.csrf).field('kind', 'document').attach('files', Buffer.from(await pdf.save()), 'auth.pdf').expect(201)
    first ??= { manager: staff.manager, vehicleId: towed.body.id }
    const moved = await d.post(`/api/vehicles/${towed.body.id}/moves`, { to: 'teardown', version: (await vehicleRow(yard.db, towed.body.id))!.version })
    expect(moved.status, JSON.stringify(moved.body)).toBe(200)
    const billed = await billedVehicle(yard.db, staff.yard.id)
    const office = await signedIn(yard.app, staff.office)
    await office.post(`/api/vehicles/${billed.id}/payments`, { idempotencyKey: key(), method: 'cash', amountCents: 5_000, tenderedCents: 5_000 }).expect(201)
  }
  backupDir = path.join(scratch, 'backup')
  await makeBackup(yard.db, { files: yard.files, key: TEST_HISTORY_KEY, outDir: backupDir, driver: 'pglite' })
})

describe('npm run db:backup / db:restore (server/backup)', () => {
  it('the restored yard equals the original: rows and checksum per table, files, chains and checkpoints', async () => {
    const fresh = await makeTestApp()
    try {
      const report = await restoreBackup(fresh.db, { backupDir, files: fresh.files, key: TEST_HISTORY_KEY })
      expect(report.problems).toEqual([])
      const [original, restored] = [await tableStats(yard.db), await tableStats(fresh.db)]
      expect(restored).toEqual(original)
      expect(original.history_events!.rows).toBeGreaterThanOrEqual(6)
      expect(original.files!.rows).toBe(4)
      expect(original.payments!.rows).toBe(2)
      expect(report.vehicles).toBe(4)
      expect(await companyCheckpoints(fresh.db, TEST_HISTORY_KEY)).toEqual(await companyCheckpoints(yard.db, TEST_HISTORY_KEY))
      // The uploads, byte for byte, under the same keys.
      // (from the files folder or the bucket, whichever the run keeps them in: see the api-s3 project)
      const names = await yard.storedKeys()
      expect(names).toHaveLength(6)
      expect(await fresh.storedKeys()).toEqual(names)
      for (const n of names) expect((await fresh.storedBytes(n)).equals(await yard.storedBytes(n))).toBe(true)
      // The restored app serves the restored yard: a vehicle's history verifies through the API.
      const manager = await signedIn(fresh.app, first!.manager)
      const verify = await manager.get(`/api/vehicles/${first!.vehicleId}/history/verify`).expect(200)
      expect(verify.body).toMatchObject({ ok: true, problems: [] })
      expect((await vehicleRow(fresh.db, first!.vehicleId)).state).toBe('teardown')
      const checkpoints = JSON.parse(readFileSync(path.join(backupDir, 'checkpoints.json'), 'utf8'))
      expect(checkpoints).toHaveLength(2)
    } finally {
      await fresh.close()
    }
  })

  it('a restore with another history key reports every chain as forged', async () => {
    const fresh = await makeTestApp()
    try {
      const report = await restoreBackup(fresh.db, { backupDir, files: fresh.files, key: randomBytes(32) })
      expect(report.problems.filter((p) => /content was changed after it was written/.test(p))).toHaveLength(4)
      expect(report.problems.at(-1)).toMatch(/checkpoints differ from the backup/)
    } finally {
      await fresh.close()
    }
  })

  it('a backup edited after it was made is caught by its checksums', async () => {
    const edited = path.join(scratch, 'edited')
    const { cpSync } = await import('node:fs')
    cpSync(backupDir, edited, { recursive: true })
    const file = path.join(edited, 'tables', 'payments.json')
    writeFileSync(file, readFileSync(file, 'utf8').replace('"amount_cents":5000', '"amount_cents":500'))
    const fresh = await makeTestApp()
    try {
      const report = await restoreBackup(fresh.db, { backupDir: edited, files: fresh.files, key: TEST_HISTORY_KEY })
      expect(report.problems).toContain('payments: the rows differ from the backup\'s (checksum)')
    } finally {
      await fresh.close()
    }
  })

  it('refuses to restore over a yard, and into a database of another version', async () => {
    await expect(restoreBackup(yard.db, { backupDir, files: yard.files, key: TEST_HISTORY_KEY })).rejects.toThrow(/already holds a yard/)
    const manifest = await readManifest(backupDir)
    const older = path.join(scratch, 'older')
    const { cpSync } = await import('node:fs')
    cpSync(backupDir, older, { recursive: true })
    writeFileSync(path.join(older, 'manifest.json'), JSON.stringify({ ...manifest, migrations: manifest.migrations.slice(0, -1) }))
    const fresh = await makeTestApp()
    try {
      await expect(restoreBackup(fresh.db, { backupDir: older, files: fresh.files, key: TEST_HISTORY_KEY })).rejects.toThrow(/same Holdfast version/)
      expect(await fresh.storedKeys()).toEqual([])
    } finally {
      await fresh.close()
    }
  })
})
