/**
 * How often a QR reader misses a gate pass's symbol: N gate passes (server/documents/gate-pass.ts, the
 * link as the app makes it: <public URL>/g/<43-character token>; the tokens are hashes of the pass's
 * number, so a run can be repeated), each page rendered by pdftoppm at the resolutions the tests
 * use, and read by the app's reader (zxing-wasm, as tests/helpers/pdf.ts reads it) and by the reader
 * it replaced (@zxing/library 0.21, as the tests read before: grey and cut to black and white, each with
 * its hybrid and its global binarizer, trying harder).
 *   npx tsx scripts/qr-survey.ts [N=200] [dpi,dpi,...=96,120,150,180,200,240,300,360] [app|old|both=both]
 * Prints, per reader, the misses at each resolution and the passes that no resolution read.
 */
import { createHash } from 'node:crypto'
import { execFile } from 'node:child_process'
import { mkdtemp, rm, writeFile } from 'node:fs/promises'
import { tmpdir } from 'node:os'
import path from 'node:path'
import { promisify } from 'node:util'
import { BinaryBitmap, DecodeHintType, GlobalHistogramBinarizer, HybridBinarizer, QRCodeReader, RGBLuminanceSource } from '@zxing/library'
import { gatePass } from '../server/documents/gate-pass'
import { readQrPixels } from '../tests/helpers/pdf'

const run = promisify(execFile)
const n = Number(process.argv[2] ?? 200)
const dpis = (process.argv[3] ?? '96,120,150,180,200,240,300,360').split(',').map(Number)
const which = process.argv[4] ?? 'both'
const surveyLink = (i: number) => `https://yard.test.example/g/${createHash('sha256').update(`holdfast-qr-survey-${i}`).digest('base64url')}`

const hints = new Map([[DecodeHintType.TRY_HARDER, true]])
/** The tests' reader before: @zxing/library 0.21 on a grey page (PGM), four ways. */
function oldReader(grey: Uint8ClampedArray, width: number, height: number): string | null {
  for (const data of [grey, grey.map((v) => (v >= 128 ? 255 : 0))]) {
    const luminance = new RGBLuminanceSource(data, width, height)
    for (const binarizer of [new HybridBinarizer(luminance), new GlobalHistogramBinarizer(luminance)]) {
      try {
        return new QRCodeReader().decode(new BinaryBitmap(binarizer), hints).getText()
      } catch {
        // the next way
      }
    }
  }
  return null
}

function pgm(bytes: Buffer) {
  const [, width, height] = /^P5\s+(\d+)\s+(\d+)\s+255\s/.exec(bytes.subarray(0, 40).toString('latin1'))!
  const header = /^P5\s+\d+\s+\d+\s+255\s/.exec(bytes.subarray(0, 40).toString('latin1'))![0].length
  return { width: Number(width), height: Number(height), grey: new Uint8ClampedArray(bytes.subarray(header)) }
}

const readers = { app: which !== 'old', old: which !== 'app' }
const dir = await mkdtemp(path.join(tmpdir(), 'qr-survey-'))
const misses = { app: new Map(dpis.map((d) => [d, [] as number[]])), old: new Map(dpis.map((d) => [d, [] as number[]])) }
const unread = { app: [] as number[], old: [] as number[] }
const pdfFile = path.join(dir, 'pass.pdf')
for (let i = 0; i < n; i++) {
  const link = surveyLink(i)
  const pdf = await gatePass(
    {
      yard: { name: 'Harbor Line Towing', address: '118 Quarry Road, Stillwater', phone: '(555) 010-4477', timeZone: 'America/Chicago' },
      vehicle: { stockNumber: 'HL-1042', year: 2014, make: 'Subaru', model: 'Outback', colour: 'Moss green', plate: '7KQ-219', plateState: 'MN' },
      space: 'B-12',
      claimantName: 'Dana Okafor',
      disposition: 'returned_to_owner',
      link,
      code: 'ABCDE-23456',
      expiresAt: new Date('2026-10-02T18:00:00Z'),
    },
    'en',
  )
  await writeFile(pdfFile, pdf)
  const read = { app: false, old: false }
  for (const dpi of dpis) {
    // The page in grey (PGM on stdout: no PNG to write and read back), as pdftoppm renders it.
    const { stdout } = await run('pdftoppm', ['-gray', '-r', String(dpi), '-f', '1', '-l', '1', '-singlefile', pdfFile], { encoding: 'buffer', maxBuffer: 1 << 28 })
    const { width, height, grey } = pgm(stdout)
    if (readers.old) {
      if (oldReader(grey, width, height) === link) read.old = true
      else misses.old.get(dpi)!.push(i)
    }
    if (readers.app) {
      const rgba = new Uint8ClampedArray(width * height * 4)
      for (let p = 0; p < grey.length; p++) {
        rgba.fill(grey[p]!, 4 * p, 4 * p + 3)
        rgba[4 * p + 3] = 255
      }
      if ((await readQrPixels(rgba, width, height)) === link) read.app = true
      else misses.app.get(dpi)!.push(i)
    }
  }
  for (const r of ['app', 'old'] as const) if (readers[r] && !read[r]) unread[r].push(i)
  if ((i + 1) % 10 === 0) {
    const so = (r: 'app' | 'old') => (readers[r] ? ` ${r}: misses ${JSON.stringify(Object.fromEntries([...misses[r]].map(([d, l]) => [d, l.length])))}, unread ${unread[r].length}` : '')
    console.error(`${i + 1}/${n}${so('app')}${so('old')}`)
  }
}
await rm(dir, { recursive: true, force: true })
const report = (r: 'app' | 'old') => ({
  missesByDpi: Object.fromEntries([...misses[r]].map(([d, l]) => [d, l.length])),
  passesMissedAtSomeDpi: new Set([...misses[r].values()].flat()).size,
  unreadAtEveryDpi: unread[r],
  missedByDpi: Object.fromEntries(misses[r]),
})
console.log(JSON.stringify({ n, dpis, ...(readers.app ? { app: report('app') } : {}), ...(readers.old ? { old: report('old') } : {}) }, null, 1))
