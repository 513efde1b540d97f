import { execFile } from 'node:child_process'
import { mkdir, mkdtemp, rm, writeFile } from 'node:fs/promises'
import { tmpdir } from 'node:os'
import path from 'node:path'
import { promisify } from 'node:util'

// poppler-utils from Debian (scripts/ensure-debian-packages.mjs installs it): pdf-lib cannot read text back.
const run = promisify(execFile)

async function withFile<T>(pdf: Uint8Array, use: (file: string) => Promise<T>): Promise<T> {
  const dir = await mkdtemp(path.join(tmpdir(), 'holdfast-pdf-'))
  try {
    const file = path.join(dir, 'in.pdf')
    await writeFile(file, pdf)
    return await use(file)
  } finally {
    await rm(dir, { recursive: true, force: true })
  }
}

/** The text of every page as pdftotext reads it; `layout` keeps columns side by side. */
export function pdfText(pdf: Uint8Array, options: { layout?: boolean } = {}): Promise<string> {
  return withFile(pdf, async (file) => (await run('pdftotext', [...(options.layout ? ['-layout'] : []), '-enc', 'UTF-8', file, '-'])).stdout)
}

/** Page size, page count and embedded fonts, as pdfinfo and pdffonts report them. */
export function pdfInfo(pdf: Uint8Array) {
  return withFile(pdf, async (file) => {
    const info = (await run('pdfinfo', [file])).stdout
    const fonts = (await run('pdffonts', [file])).stdout
    const size = info.match(/Page size:\s+([\d.]+) x ([\d.]+) pts/)
    return {
      pages: Number(info.match(/Pages:\s+(\d+)/)?.[1]),
      widthPt: Number(size?.[1]),
      heightPt: Number(size?.[2]),
      // pdffonts lists name, type, encoding, emb, sub, uni, object, id; the first two lines are headings.
      fonts: fonts
        .split('\n')
        .slice(2)
        .filter(Boolean)
        .map((line) => {
          const cols = line.trim().split(/\s+/)
          // pdf-lib subsets without the ABCDEF+ name tag, so pdffonts's "sub" says no: judge by the file size.
          return { name: cols[0]!, embedded: cols.at(-5) === 'yes' }
        }),
    }
  })
}

/**
 * Renders page 1 to test-results/<name>.png (96 dpi unless told) so that a broken layout can be seen;
 * returns the path. A page whose QR is read back renders finer: at 96 dpi a module's edges blur.
 */
export async function renderFirstPage(pdf: Uint8Array, name: string, dpi = 96): Promise<string> {
  const out = path.resolve('test-results', 'pdf')
  await mkdir(out, { recursive: true })
  const prefix = path.join(out, name)
  await withFile(pdf, (file) => run('pdftoppm', ['-png', '-r', String(dpi), '-f', '1', '-l', '1', '-singlefile', file, prefix]))
  return `${prefix}.png`
}

/**
 * Reads the QR code on a rendered page (a PNG) with the reader the app's scanner uses: ZXing's C++ library
 * as WebAssembly (zxing-wasm, which barcode-detector wraps in the browser), with the options
 * barcode-detector gives it. The .wasm is read from node_modules, never fetched.
 */
export async function readQr(png: string): Promise<string> {
  const { default: sharp } = await import('sharp')
  const { data, info } = await sharp(png).ensureAlpha().raw().toBuffer({ resolveWithObject: true })
  const text = await readQrPixels(new Uint8ClampedArray(data.buffer, data.byteOffset, data.length), info.width, info.height)
  if (text === null) throw new Error(`no QR code read in ${png}`)
  return text
}

/** The same reader on RGBA pixels: the text of the first valid QR code, or null. */
export async function readQrPixels(rgba: Uint8ClampedArray, width: number, height: number): Promise<string | null> {
  const [found] = await (await qrReader())({ data: rgba, width, height, colorSpace: 'srgb' } as ImageData, { formats: ['QRCode'] })
  return found?.isValid ? found.text : null
}

let reader: Promise<typeof import('zxing-wasm/reader').readBarcodes> | undefined
function qrReader() {
  reader ??= (async () => {
    const { prepareZXingModule, readBarcodes } = await import('zxing-wasm/reader')
    const { createRequire } = await import('node:module')
    const { readFile } = await import('node:fs/promises')
    const wasm = await readFile(createRequire(import.meta.url).resolve('zxing-wasm/reader/zxing_reader.wasm'))
    await prepareZXingModule({ overrides: { wasmBinary: wasm.buffer.slice(wasm.byteOffset, wasm.byteOffset + wasm.length) as ArrayBuffer }, fireImmediately: true })
    return readBarcodes
  })()
  return reader
}

/**
 * The QR code on page 1 of a PDF, rendered at `dpi` (150 unless told) and read once: no second try at
 * another size (tests/unit/documents/qr-symbols.test.ts reads symbols at every size the tests use).
 */
export async function readQrOfPdf(pdf: Uint8Array, name: string, dpi = 150): Promise<string> {
  return readQr(await renderFirstPage(pdf, name, dpi))
}
