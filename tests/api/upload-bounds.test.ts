import http from 'node:http'
import type { AddressInfo } from 'node:net'
import { afterAll, beforeAll, beforeEach, describe, expect, it } from 'vitest'
import { MAX_PDF_OBJECTS, MAX_PDF_PAGES, MAX_UPLOADS_IN_PROGRESS_PER_USER } from '@shared/schemas/files'
import { uploadsInProgress } from '../../server/files/upload'
import { makeTestApp, signedIn, type BrowserSession, type TestApp } from '../helpers/app'
import { makeStaff } from '../helpers/factories'
import { counts, photo, towInBody } from '../helpers/tow-in'

// Issue 13 item 5: an upload's work is bounded (objects, pages, time, memory, pixels) and per user.
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

/** A PDF of `n` empty dictionaries plus one page: cheap to write, expensive for a parser to open. */
function manyObjectPdf(n: number): Buffer {
  const parts = ['%PDF-1.4\n1 0 obj\n<< /Type /Catalog /Pages 2 0 R >>\nendobj\n2 0 obj\n<< /Type /Pages /Kids [3 0 R] /Count 1 >>\nendobj\n3 0 obj\n<< /Type /Page /Parent 2 0 R /MediaBox [0 0 200 200] >>\nendobj\n']
  for (let i = 4; i < n + 4; i++) parts.push(`${i} 0 obj\n<< /N ${i} >>\nendobj\n`)
  parts.push('trailer\n<< /Root 1 0 R >>\n%%EOF\n')
  return Buffer.from(parts.join(''))
}

async function pdfOfPages(pages: number): Promise<Buffer> {
  const { PDFDocument } = await import('pdf-lib')
  const doc = await PDFDocument.create()
  for (let i = 0; i < pages; i++) doc.addPage([200, 200])
  return Buffer.from(await doc.save())
}

async function vehicleId() {
  return (await d.post('/api/vehicles', towInBody(staff.dispatcher.id)).expect(201)).body.id as string
}

async function refusedDocument(id: string, pdf: Buffer, name: string) {
  const [before, onDisk] = [await counts(app.db), await app.storedKeys()]
  const res = await d.agent.post(`/api/vehicles/${id}/files`).set('x-csrf-token', d.csrf).field('kind', 'document').attach('files', pdf, name)
  expect(res.status, JSON.stringify(res.body)).toBe(400)
  expect(await counts(app.db)).toEqual(before)
  expect(await app.storedKeys()).toEqual(onDisk)
  return res.body as { error: string; issues: { path: string; message: string }[] }
}

describe('an upload costs a bounded amount of work', () => {
  it(`a PDF of 400,000 objects is refused before it is parsed, naming the file`, async () => {
    const id = await vehicleId()
    const body = await refusedDocument(id, manyObjectPdf(400_000), 'bomb.pdf')
    expect(body.issues).toEqual([
      {
        path: 'files.0',
        message: `bomb.pdf: The PDF has more than ${MAX_PDF_OBJECTS.toLocaleString('en-US')} parts; a scan or form this complex cannot be accepted. Print it to a new PDF, or photograph the pages.`,
        code: 'files.pdfParts',
        params: { name: 'bomb.pdf', max: MAX_PDF_OBJECTS.toLocaleString('en-US') },
      },
    ])
  })

  it(`a PDF of more than ${MAX_PDF_PAGES} pages is refused; one of ${MAX_PDF_PAGES} is kept`, async () => {
    const id = await vehicleId()
    const body = await refusedDocument(id, await pdfOfPages(MAX_PDF_PAGES + 1), 'long.pdf')
    expect(body.issues).toEqual([
      { path: 'files.0', message: `long.pdf: The PDF has ${MAX_PDF_PAGES + 1} pages; at most ${MAX_PDF_PAGES} are accepted. Split it into parts.`, code: 'files.pdfPages', params: { name: 'long.pdf', pages: MAX_PDF_PAGES + 1, max: MAX_PDF_PAGES } },
    ])
    const ok = await d.agent.post(`/api/vehicles/${id}/files`).set('x-csrf-token', d.csrf).field('kind', 'document').attach('files', await pdfOfPages(MAX_PDF_PAGES), 'ok.pdf')
    expect(ok.status, JSON.stringify(ok.body)).toBe(201)
  })

  it('objects hidden in compressed object streams are counted too', async () => {
    // pdf-lib writes its objects into object streams when asked: the raw bytes show few "obj" markers.
    const { PDFDocument } = await import('pdf-lib')
    const doc = await PDFDocument.create()
    doc.addPage([200, 200])
    for (let i = 0; i < MAX_PDF_OBJECTS + 10; i++) doc.context.register(doc.context.obj({ N: i }))
    const pdf = Buffer.from(await doc.save({ useObjectStreams: true }))
    expect((pdf.toString('latin1').match(/ obj\b/g) ?? []).length).toBeLessThan(MAX_PDF_OBJECTS)
    const id = await vehicleId()
    const body = await refusedDocument(id, pdf, 'packed.pdf')
    expect(body.issues[0]!.message).toMatch(/^packed\.pdf: The PDF has more than [\d,]+ parts/)
  })

  it('a NUL in a file name is refused with 400 naming the field, nothing written', async () => {
    const before = await counts(app.db)
    const res = await d.agent
      .post('/api/vehicles')
      .set('x-csrf-token', d.csrf)
      .field('data', JSON.stringify(towInBody(staff.dispatcher.id)))
      .attach('photos', await photo(), { filename: 'front\u0000.jpg', contentType: 'image/jpeg' })
    expect(res.status, JSON.stringify(res.body)).toBe(400)
    expect(res.body.issues).toEqual([{ path: 'photos', message: expect.stringMatching(/file name/), code: 'files.badName' }])
    expect(await counts(app.db)).toEqual(before)
  })

  it(`one user has at most ${MAX_UPLOADS_IN_PROGRESS_PER_USER} uploads in progress: the next is refused with 429 until one ends`, async () => {
    const id = await vehicleId()
    const server = http.createServer(app.app).listen(0, '127.0.0.1')
    await new Promise((r) => server.once('listening', r))
    const { port } = server.address() as AddressInfo
    const jar = (d.agent as unknown as { jar: { getCookies(a: object): { toValueString(): string }[] } }).jar
    const cookie = jar.getCookies({ domain: '127.0.0.1', path: '/', secure: false, script: false }).map((c) => c.toValueString()).join('; ')
    const jpeg = await photo()
    const boundary = 'holdfastboundary'
    const head = `--${boundary}\r\nContent-Disposition: form-data; name="files"; filename="slow.jpg"\r\nContent-Type: image/jpeg\r\n\r\n`
    const tail = Buffer.from(`\r\n--${boundary}--\r\n`)
    /** An upload that sends its headers and ten bytes of its file, then waits to be finished. */
    const slowUpload = () => {
      const req = http.request({
        host: '127.0.0.1',
        port,
        method: 'POST',
        path: `/api/vehicles/${id}/files`,
        headers: { 'content-type': `multipart/form-data; boundary=${boundary}`, cookie, 'x-csrf-token': d.csrf, 'content-length': String(Buffer.byteLength(head) + jpeg.length + tail.length) },
      })
      const answer = new Promise<number>((resolve, reject) => {
        req.on('response', (res) => {
          res.resume()
          res.on('end', () => resolve(res.statusCode!))
        })
        req.on('error', reject)
      })
      req.write(head)
      req.write(jpeg.subarray(0, 10))
      return { answer, finish: () => req.end(Buffer.concat([jpeg.subarray(10), tail])) }
    }
    try {
      const slow = Array.from({ length: MAX_UPLOADS_IN_PROGRESS_PER_USER }, (_, i) => i)
      const started = []
      for (const i of slow) {
        started.push(slowUpload())
        // Wait until the server has begun receiving it, by its own count of uploads in progress.
        await expect.poll(() => uploadsInProgress(staff.dispatcher.id), { timeout: 10_000 }).toBe(i + 1)
      }
      const refused = await d.agent.post(`/api/vehicles/${id}/files`).set('x-csrf-token', d.csrf).attach('files', jpeg, 'next.jpg')
      expect(refused.status).toBe(429)
      expect(refused.body.issues).toEqual([{ path: 'files', message: expect.stringMatching(/^Your earlier uploads are still being received or checked/), code: 'files.busy', params: { max: expect.any(Number) } }])
      // Another member of staff is not held up by the dispatcher's uploads.
      const manager = await signedIn(app.app, staff.manager)
      await manager.agent.post(`/api/vehicles/${id}/files`).set('x-csrf-token', manager.csrf).attach('files', jpeg, 'other.jpg').expect(201)
      for (const s of started) s.finish()
      expect(await Promise.all(started.map((s) => s.answer))).toEqual(slow.map(() => 201))
      await expect.poll(() => uploadsInProgress(staff.dispatcher.id)).toBe(0)
      await d.agent.post(`/api/vehicles/${id}/files`).set('x-csrf-token', d.csrf).attach('files', jpeg, 'after.jpg').expect(201)
    } finally {
      server.close()
    }
  })
})
