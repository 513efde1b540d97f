import { readFileSync } from 'node:fs'
import path from 'node:path'
import { createHash } from 'node:crypto'
import { createRequire } from 'node:module'
import { eq } from 'drizzle-orm'
import request from 'supertest'
import sharp from 'sharp'
import { afterAll, beforeAll, beforeEach, describe, expect, it } from 'vitest'
import * as t from '@db/schema'
import { MAX_FILE_BYTES } from '@shared/schemas/files'
import { makeTestApp, signedIn, type BrowserSession, type TestApp } from '../helpers/app'
import { makeCompany, makeStaff, makeUser } from '../helpers/factories'
import { counts, photo, pngImage, towInBody } from '../helpers/tow-in'

let app: TestApp
let staff: Awaited<ReturnType<typeof makeStaff>>
let d: BrowserSession
beforeAll(async () => {
  app = await makeTestApp()
})
afterAll(() => app.close())
beforeEach(async () => {
  staff = await makeStaff(app.db)
  d = await signedIn(app.app, staff.dispatcher)
})

type Part = { data: Buffer; name: string; type?: string }

function towInWithPhotos(parts: Part[]) {
  let req = d.agent.post('/api/vehicles').set('x-csrf-token', d.csrf).field('data', JSON.stringify(towInBody(staff.dispatcher.id)))
  for (const p of parts) req = req.attach('photos', p.data, { filename: p.name, contentType: p.type ?? 'image/jpeg' })
  return req
}

const sha256 = (b: Buffer) => createHash('sha256').update(b).digest('hex')

describe('photos at tow-in', () => {
  it('two photos are re-encoded, thumbnailed, hashed in the history and kept outside any served folder', async () => {
    const onDisk = (await app.storedKeys()).length
    const res = await towInWithPhotos([
      { data: await photo(), name: 'front.jpg' },
      { data: await pngImage(), name: 'rear.png', type: 'image/png' },
    ])
    expect(res.status, JSON.stringify(res.body)).toBe(201)
    const rows = await app.db.select().from(t.files).where(eq(t.files.vehicleId, res.body.id))
    expect(rows).toHaveLength(2)
    expect(rows.every((r) => r.mime === 'image/jpeg' && r.kind === 'photo' && r.uploadedById === staff.dispatcher.id)).toBe(true)
    // Server-made keys only; nothing of the browser's names.
    expect(rows.map((r) => r.storageKey).join(' ')).not.toMatch(/front|rear/)
    expect(await app.storedKeys()).toHaveLength(onDisk + 4)
    const page = (await d.get(`/api/vehicles/${res.body.id}`)).body
    const added = page.history.find((e: { kind: string }) => e.kind === 'file_added')
    expect(added.after.files.map((f: { sha256: string }) => f.sha256).sort()).toEqual(rows.map((r) => r.sha256).sort())
    for (const r of rows) expect(sha256(await app.storedBytes(r.storageKey))).toBe(r.sha256)
  })

  it('strips the metadata and turns the pixels by the EXIF orientation', async () => {
    const original = await photo(64, 40)
    expect(original.includes('secret-camera-owner')).toBe(true)
    const res = await towInWithPhotos([{ data: original, name: 'side.jpg' }]).expect(201)
    const [row] = await app.db.select().from(t.files).where(eq(t.files.vehicleId, res.body.id))
    const stored = await app.storedBytes(row!.storageKey)
    expect(stored.includes('secret-camera-owner')).toBe(false)
    const meta = await sharp(stored).metadata()
    expect(meta.exif).toBeUndefined()
    // Orientation 6 is a quarter turn: the 64×40 sensor image is stored upright as 40×64.
    expect([meta.width, meta.height, row!.width, row!.height]).toEqual([40, 64, 40, 64])
  })
})

describe('refused uploads leave no row and no file', () => {
  async function refusedUpload(parts: Part[], status: number) {
    const [before, onDisk] = [await counts(app.db), await app.storedKeys()]
    const res = await towInWithPhotos(parts)
    expect(res.status, JSON.stringify(res.body)).toBe(status)
    expect(await counts(app.db)).toEqual(before)
    // Not even a half-written ".part" file is left behind.
    expect(await app.storedKeys()).toEqual(onDisk)
    return res.body as { error: string; issues: { path: string; message: string }[] }
  }

  it('a PDF renamed .jpg is refused by its bytes', async () => {
    const body = await refusedUpload([{ data: await photo(), name: 'ok.jpg' }, { data: Buffer.from('%PDF-1.4\n1 0 obj\n<<>>\nendobj\n'), name: 'photo.jpg' }], 400)
    expect(body.issues).toEqual([
      {
        path: 'photos.1',
        message: "photo.jpg: The file's contents are PDF (application/pdf), whatever its name says. Use JPEG, PNG, WebP or HEIC photos.",
        code: 'files.wrongType',
        params: { name: 'photo.jpg', type: 'PDF', mime: 'application/pdf', what: 'photoTypes' },
      },
    ])
  })

  it('a text file renamed .jpg is refused', async () => {
    const body = await refusedUpload([{ data: Buffer.from('Notes from the driver, not a photo at all.'), name: 'engine.jpg' }], 400)
    expect(body.error).toBe("engine.jpg: The file's contents are not an image or a PDF, whatever its name says. Use JPEG, PNG, WebP or HEIC photos.")
  })

  it('an SVG is refused, whatever it is called', async () => {
    const svg = Buffer.from('<?xml version="1.0"?><svg xmlns="http://www.w3.org/2000/svg"><script>alert(1)</script></svg>')
    const body = await refusedUpload([{ data: svg, name: 'damage.jpg', type: 'image/jpeg' }], 400)
    expect(body.error).toBe('damage.jpg: SVG drawings are not accepted (they can carry scripts). Use JPEG, PNG, WebP or HEIC photos.')
  })

  it('an empty file is refused', async () => {
    const body = await refusedUpload([{ data: Buffer.alloc(0), name: 'empty.jpg' }], 400)
    expect(body.error).toBe('empty.jpg: The file is empty.')
  })

  it('a file over the size limit is refused while it arrives', async () => {
    const body = await refusedUpload([{ data: Buffer.alloc(MAX_FILE_BYTES + 1, 0xff), name: 'huge.jpg' }], 413)
    expect(body.error).toBe('A file is larger than 20 MB. Nothing was saved.')
  })

  it('a JPEG cut short is refused as damaged', async () => {
    const whole = await sharp({ create: { width: 400, height: 300, channels: 3, background: '#b4443a' } }).jpeg().toBuffer()
    const body = await refusedUpload([{ data: whole.subarray(0, 300), name: 'cut.jpg' }], 400)
    expect(body.error).toBe('cut.jpg: The image could not be read: it may be damaged, cut short or too large to open.')
  })

  it('an iPhone-style HEIC photo is decoded and kept as a JPEG of the same size', async () => {
    // tests/fixtures/photo-640x480.heic: made with libheif's heif-enc (HEVC) from a 640×480 JPEG.
    const heic = readFileSync(path.join(import.meta.dirname, '../fixtures/photo-640x480.heic'))
    const res = await towInWithPhotos([{ data: heic, name: 'IMG_0042.HEIC', type: 'image/heic' }])
    expect(res.status, JSON.stringify(res.body)).toBe(201)
    const [row] = await app.db.select().from(t.files).where(eq(t.files.vehicleId, res.body.id))
    expect(row).toMatchObject({ mime: 'image/jpeg', width: 640, height: 480 })
    const stored = await sharp(await app.storedBytes(row!.storageKey)).metadata()
    expect(stored).toMatchObject({ format: 'jpeg', width: 640, height: 480 })
    // The source had an amber (#E9A23B) block at 40-240 × 40-160 on grey: the pixels survive the trip.
    const { data } = await sharp(await app.storedBytes(row!.storageKey)).extract({ left: 140, top: 100, width: 1, height: 1 }).raw().toBuffer({ resolveWithObject: true })
    expect([...data].map((c, i) => Math.abs(c - [0xe9, 0xa2, 0x3b][i]!)).every((d) => d < 24)).toBe(true)
    // Issue 13: libheif decodes in a worker thread; it is never loaded on the request loop.
    expect(Object.keys(createRequire(import.meta.url).cache).filter((m) => m.includes('heic-decode') || m.includes('libheif'))).toEqual([])
  })

  it('a damaged HEIC photo is refused with what to do instead', async () => {
    // An ISO-BMFF "ftyp heic" header with nothing behind it: sniffed as HEIC, but it holds no image.
    const heic = Buffer.concat([Buffer.from([0, 0, 0, 24]), Buffer.from('ftypheic\0\0\0\0mif1heic'), Buffer.alloc(64)])
    const body = await refusedUpload([{ data: heic, name: 'IMG_0042.HEIC', type: 'image/heic' }], 400)
    expect(body.error).toBe("IMG_0042.HEIC: This HEIC photo could not be read: it may be damaged or too large. On the phone, set the camera to 'Most compatible' or share the photo as JPEG, then add it again.")
  })

  it('a valid tow-in with a refused photo writes neither the vehicle nor the good photo', async () => {
    await refusedUpload([{ data: await photo(), name: 'good.jpg' }, { data: Buffer.alloc(0), name: 'bad.jpg' }], 400)
  })
})

describe('adding files later and reading them back', () => {
  async function vehicleId() {
    return (await d.post('/api/vehicles', towInBody(staff.dispatcher.id)).expect(201)).body.id as string
  }

  it('a dispatcher adds a document; it is recorded in the history and streamed back with safe headers', async () => {
    const id = await vehicleId()
    const pdf = await tinyPdf()
    const res = await d.agent.post(`/api/vehicles/${id}/files`).set('x-csrf-token', d.csrf).field('kind', 'document').field('label', 'Tow authorisation').attach('files', pdf, 'auth.pdf')
    expect(res.status, JSON.stringify(res.body)).toBe(201)
    expect(res.body.files).toEqual([expect.objectContaining({ kind: 'document', mime: 'application/pdf', label: 'Tow authorisation', thumbUrl: null })])
    const file = await d.get(res.body.files[0].url).expect(200)
    expect(file.headers['content-type']).toBe('application/pdf')
    expect(file.headers['content-disposition']).toMatch(/^attachment; filename="T[A-Z]+-\d{4}-00001-document-[0-9a-f]{8}\.pdf"$/)
    expect(file.headers['x-content-type-options']).toBe('nosniff')
    expect(file.body.subarray(0, 5).toString()).toBe('%PDF-')
    expect(file.body.includes('Secret Author')).toBe(false)
    const page = (await d.get(`/api/vehicles/${id}`)).body
    expect(page.history.at(-1)).toMatchObject({ kind: 'file_added', actor: 'Test dispatcher', after: { files: [{ kind: 'document', label: 'Tow authorisation' }] } })
  })

  it('a photo and its thumbnail are served only to staff of the company', async () => {
    const id = await vehicleId()
    const res = await d.agent.post(`/api/vehicles/${id}/files`).set('x-csrf-token', d.csrf).attach('files', await photo(), 'door.jpg').expect(201)
    const { url, thumbUrl } = res.body.files[0]
    const tech = await signedIn(app.app, staff.technician)
    expect((await tech.get(url)).headers['content-disposition']).toMatch(/^inline; filename=/)
    expect((await tech.get(thumbUrl)).headers['content-type']).toBe('image/jpeg')
    expect((await request(app.app).get(url)).status).toBe(401)
    const stranger = await signedIn(app.app, await makeUser(app.db, (await makeCompany(app.db, 'Rival Recovery')).company.id, 'manager'))
    expect((await stranger.get(url)).status).toBe(404)
  })

  it('a photo is revalidated on every view: 304 with the same ETag for staff, 401 once signed out', async () => {
    const id = await vehicleId()
    const res = await d.agent.post(`/api/vehicles/${id}/files`).set('x-csrf-token', d.csrf).attach('files', await photo(), 'door.jpg').expect(201)
    const { url } = res.body.files[0]
    const first = await d.get(url).expect(200)
    expect(first.headers['cache-control']).toBe('private, no-cache')
    const again = await d.agent.get(url).set('if-none-match', String(first.headers.etag))
    expect(again.status).toBe(304)
    expect(again.body).toEqual({})
    await d.del('/api/session').expect(204)
    expect((await d.agent.get(url).set('if-none-match', String(first.headers.etag))).status).toBe(401)
  })

  it('a technician may not add files to the tow-in record', async () => {
    const id = await vehicleId()
    const tech = await signedIn(app.app, staff.technician)
    const res = await tech.agent.post(`/api/vehicles/${id}/files`).set('x-csrf-token', tech.csrf).attach('files', await photo(), 'door.jpg')
    expect(res.status).toBe(403)
    expect(await app.db.$count(t.files, eq(t.files.vehicleId, id))).toBe(0)
  })

  it('sending no file is refused', async () => {
    const id = await vehicleId()
    const res = await d.agent.post(`/api/vehicles/${id}/files`).set('x-csrf-token', d.csrf).field('kind', 'photo')
    expect(res.status).toBe(422)
    expect(res.body.error).toBe('Choose at least one file to add.')
  })
})

async function tinyPdf() {
  const { PDFDocument } = await import('pdf-lib')
  const doc = await PDFDocument.create()
  doc.addPage([200, 200])
  doc.setAuthor('Secret Author')
  return Buffer.from(await doc.save())
}
