import { eq } from 'drizzle-orm'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import * as t from '@db/schema'
import { FileMissingError } from '../../server/files/file-store'
import { makeTestApp, signedIn, type TestApp } from '../helpers/app'
import { makeStaff } from '../helpers/factories'
import { photo, towInBody } from '../helpers/tow-in'

// Issue 15, "Files": the same behaviour from the files folder and from a bucket. The api project runs
// this on disk; the api-s3 project runs it again with every file in the local S3 stand-in.
let app: TestApp
let staff: Awaited<ReturnType<typeof makeStaff>>
let vehicleId: string
let photoRow: typeof t.files.$inferSelect
let pdfRow: typeof t.files.$inferSelect
beforeAll(async () => {
  app = await makeTestApp()
  staff = await makeStaff(app.db)
  const d = await signedIn(app.app, staff.dispatcher)
  const towed = await d.agent.post('/api/vehicles').set('x-csrf-token', d.csrf).field('data', JSON.stringify(towInBody(staff.dispatcher.id))).attach('photos', await photo(), 'front.jpg')
  expect(towed.status, JSON.stringify(towed.body)).toBe(201)
  vehicleId = towed.body.id
  const { PDFDocument } = await import('pdf-lib')
  const pdf = await PDFDocument.create()
  pdf.addPage([200, 200])
  await d.agent.post(`/api/vehicles/${vehicleId}/files`).set('x-csrf-token', d.csrf).field('kind', 'document').attach('files', Buffer.from(await pdf.save()), 'authorisation.pdf').expect(201)
  const rows = await app.db.select().from(t.files).where(eq(t.files.vehicleId, vehicleId))
  photoRow = rows.find((r) => r.kind === 'photo')!
  pdfRow = rows.find((r) => r.kind === 'document')!
})
afterAll(() => app?.close())

describe('the file store (server/files)', () => {
  it('puts, lists, reads back and deletes a file under its key; a deleted key is missing', async () => {
    const key = `vehicles/${vehicleId}/storage-check.jpg`
    const data = Buffer.from('not really a photo, only bytes')
    await app.files.put(key, data)
    expect(await app.storedKeys()).toContain(key)
    const opened = await app.files.get(key)
    expect(opened.bytes).toBe(data.length)
    expect((await app.storedBytes(key)).equals(data)).toBe(true)
    await app.files.delete(key)
    expect(await app.storedKeys()).not.toContain(key)
    await expect(app.files.get(key)).rejects.toBeInstanceOf(FileMissingError)
  })

  it('refuses a key that could leave its folder before anything is written', async () => {
    const before = await app.storedKeys()
    await expect(app.files.put('../outside.jpg', Buffer.from('x'))).rejects.toThrow(/not a storage key/)
    await expect(app.files.put('vehicles/a/../../b.jpg', Buffer.from('x'))).rejects.toThrow(/not a storage key/)
    expect(await app.storedKeys()).toEqual(before)
  })

  it('the store answers its readiness check', async () => {
    await expect(app.files.check()).resolves.toBeUndefined()
  })
})

describe('downloads: streamed through the server after its access check', () => {
  it('staff of the company get the stored bytes, the thumbnail, and a PDF as an attachment', async () => {
    const tech = await signedIn(app.app, staff.technician)
    const full = await tech.get(`/api/files/${photoRow.id}`).buffer(true).expect(200)
    expect(Buffer.from(full.body).equals(await app.storedBytes(photoRow.storageKey))).toBe(true)
    expect(full.headers['content-type']).toBe('image/jpeg')
    expect(full.headers['cache-control']).toBe('private, no-cache')
    const thumb = await tech.get(`/api/files/${photoRow.id}/thumb`).buffer(true).expect(200)
    expect(Buffer.from(thumb.body).equals(await app.storedBytes(photoRow.thumbKey!))).toBe(true)
    const pdf = await tech.get(`/api/files/${pdfRow.id}`).buffer(true).expect(200)
    expect(pdf.headers['content-disposition']).toMatch(/^attachment; filename=".*\.pdf"$/)
    expect(Buffer.from(pdf.body).subarray(0, 5).toString('latin1')).toBe('%PDF-')
  })

  it('a download after the session has expired, or after signing out, is refused', async () => {
    const office = await signedIn(app.app, staff.office)
    await office.get(`/api/files/${photoRow.id}`).expect(200)
    await app.db.update(t.sessions).set({ expiresAt: new Date(Date.now() - 1000) }).where(eq(t.sessions.userId, staff.office.id))
    expect((await office.get(`/api/files/${photoRow.id}`)).status).toBe(401)
    const manager = await signedIn(app.app, staff.manager)
    await manager.get(`/api/files/${photoRow.id}/thumb`).expect(200)
    await manager.del('/api/session').expect(204)
    expect((await manager.get(`/api/files/${photoRow.id}/thumb`)).status).toBe(401)
  })

  it('a tampered address is refused: another id, another company, a thumbnail a PDF does not have, a broken id', async () => {
    const d = await signedIn(app.app, staff.dispatcher)
    const flipped = photoRow.id.slice(0, -1) + (photoRow.id.endsWith('0') ? '1' : '0')
    expect((await d.get(`/api/files/${flipped}`)).status).toBe(404)
    expect((await d.get(`/api/files/${pdfRow.id}/thumb`)).status).toBe(404)
    expect((await d.get(`/api/files/${photoRow.id.slice(0, -1)}`)).status).toBe(400)
    const stranger = await signedIn(app.app, (await makeStaff(app.db)).manager)
    const refused = await stranger.get(`/api/files/${photoRow.id}`)
    expect(refused.status).toBe(404)
    expect(refused.headers['content-type']).toMatch(/json/)
  })
})
