import { mkdirSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs'
import { tmpdir } from 'node:os'
import path from 'node:path'
import { brotliCompressSync, gzipSync } from 'node:zlib'
import request from 'supertest'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { makeTestApp, type TestApp } from '../helpers/app'

// A client folder shaped like `npm run build`'s: a hashed script with its .br and .gz beside it
// (vite-plugin-compression2), and a hashed image the build does not compress.
const SCRIPT = `export const greeting = ${JSON.stringify('tow-in to release '.repeat(200))}\n`
const INDEX = '<!doctype html><html><head><title>Holdfast</title></head><body><div id="app"></div></body></html>\n'
const IMAGE = Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a])
// The barcode scanner's reader: a WebAssembly module's header and a few bytes, with its .br (the build's).
const WASM = Buffer.concat([Buffer.from([0x00, 0x61, 0x73, 0x6d, 0x01, 0x00, 0x00, 0x00]), Buffer.alloc(2048)])
const br = brotliCompressSync(SCRIPT)
const gz = gzipSync(SCRIPT)
const IMMUTABLE = 'public, max-age=31536000, immutable'

let clientDir: string
let app: TestApp
beforeAll(async () => {
  clientDir = mkdtempSync(path.join(tmpdir(), 'holdfast-client-'))
  mkdirSync(path.join(clientDir, 'assets'))
  writeFileSync(path.join(clientDir, 'index.html'), INDEX)
  writeFileSync(path.join(clientDir, 'index.html.br'), brotliCompressSync(INDEX))
  writeFileSync(path.join(clientDir, 'assets', 'index-Ab12Cd34.js'), SCRIPT)
  writeFileSync(path.join(clientDir, 'assets', 'index-Ab12Cd34.js.br'), br)
  writeFileSync(path.join(clientDir, 'assets', 'index-Ab12Cd34.js.gz'), gz)
  writeFileSync(path.join(clientDir, 'assets', 'marker-Ef56Gh78.png'), IMAGE)
  writeFileSync(path.join(clientDir, 'assets', 'zxing_reader-Ij90Kl12.wasm'), WASM)
  writeFileSync(path.join(clientDir, 'assets', 'zxing_reader-Ij90Kl12.wasm.br'), brotliCompressSync(WASM))
  app = await makeTestApp({ clientDir })
})
afterAll(async () => {
  await app.close()
  rmSync(clientDir, { recursive: true, force: true })
})

const getScript = (acceptEncoding: string) =>
  request(app.app).get('/assets/index-Ab12Cd34.js').set('accept-encoding', acceptEncoding).buffer(true).expect(200)

describe('the built client goes out precompressed', () => {
  it('a browser that accepts Brotli gets the .br file, marked so, with the long cache kept', async () => {
    const res = await getScript('br')
    expect(res.headers['content-encoding']).toBe('br')
    expect(res.headers['content-length']).toBe(String(br.length))
    expect(res.headers['vary']).toMatch(/accept-encoding/i)
    expect(res.headers['content-type']).toMatch(/^text\/javascript/)
    expect(res.headers['cache-control']).toBe(IMMUTABLE)
    expect(res.text).toBe(SCRIPT)
  })

  it('a browser offering gzip, deflate and br (as Chromium does) gets Brotli, the smaller', async () => {
    const res = await getScript('gzip, deflate, br, zstd')
    expect(res.headers['content-encoding']).toBe('br')
    expect(br.length).toBeLessThan(gz.length)
  })

  it('a browser that accepts only gzip gets the .gz file', async () => {
    const res = await getScript('gzip')
    expect(res.headers['content-encoding']).toBe('gzip')
    expect(res.headers['content-length']).toBe(String(gz.length))
    expect(res.headers['vary']).toMatch(/accept-encoding/i)
    expect(res.headers['cache-control']).toBe(IMMUTABLE)
    expect(res.text).toBe(SCRIPT)
  })

  it.each(['identity', 'br;q=0, gzip;q=0'])('a client that refuses compression (%s) gets the plain file', async (acceptEncoding) => {
    const res = await getScript(acceptEncoding)
    expect(res.headers['content-encoding']).toBeUndefined()
    expect(res.headers['content-length']).toBe(String(Buffer.byteLength(SCRIPT)))
    expect(res.headers['vary']).toMatch(/accept-encoding/i)
    expect(res.headers['cache-control']).toBe(IMMUTABLE)
    expect(res.text).toBe(SCRIPT)
  })

  it('a file the build left uncompressed goes out as it is, still cached for good', async () => {
    const res = await request(app.app).get('/assets/marker-Ef56Gh78.png').set('accept-encoding', 'gzip, br').expect(200)
    expect(res.headers['content-encoding']).toBeUndefined()
    expect(res.headers['content-type']).toBe('image/png')
    expect(res.headers['cache-control']).toBe(IMMUTABLE)
  })

  it('the scanner\'s WebAssembly goes out as application/wasm (Brotli, cached for good), and the page may compile it but not eval', async () => {
    const res = await request(app.app).get('/assets/zxing_reader-Ij90Kl12.wasm').set('accept-encoding', 'br').buffer(true).expect(200)
    // WebAssembly.instantiateStreaming refuses any other type.
    expect(res.headers['content-type']).toBe('application/wasm')
    expect(res.headers['content-encoding']).toBe('br')
    expect(res.headers['cache-control']).toBe(IMMUTABLE)
    const page = await request(app.app).get('/gate').expect(200)
    const scriptSrc = /script-src ([^;]*)/.exec(page.headers['content-security-policy'] ?? '')?.[1]
    expect(scriptSrc?.split(' ').sort()).toEqual(["'self'", "'wasm-unsafe-eval'"])
  })

  it('a client-side route gets index.html, not cached, without a compressed twin leaking through', async () => {
    const res = await request(app.app).get('/board').set('accept-encoding', 'br').expect(200)
    expect(res.headers['content-encoding']).toBeUndefined()
    expect(res.headers['cache-control']).toBe('no-cache')
    expect(res.text).toBe(INDEX)
  })
})
