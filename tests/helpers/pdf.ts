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
 * Reads the QR code on a rendered page (a PNG) with ZXing, the library the app's scanner uses: as rendered
 * and cut to black and white, each with its local (hybrid) binarizer and its global one, trying harder.
 */
export async function readQr(png: string): Promise<string> {
  const { default: sharp } = await import('sharp')
  const { BinaryBitmap, DecodeHintType, GlobalHistogramBinarizer, HybridBinarizer, QRCodeReader, RGBLuminanceSource } = await import('@zxing/library')
  const hints = new Map([[DecodeHintType.TRY_HARDER, true]])
  let last: unknown
  // As rendered (grey edges), then cut to black and white at mid-grey.
  for (const image of [sharp(png).greyscale(), sharp(png).greyscale().threshold(128)]) {
    const { data, info } = await image.raw().toBuffer({ resolveWithObject: true })
    const luminance = new RGBLuminanceSource(new Uint8ClampedArray(data), info.width, info.height)
    for (const binarizer of [new HybridBinarizer(luminance), new GlobalHistogramBinarizer(luminance)]) {
      try {
        return new QRCodeReader().decode(new BinaryBitmap(binarizer), hints).getText()
      } catch (err) {
        last = err
      }
    }
  }
  throw last
}

/**
 * The QR code on page 1, rendered at several resolutions until ZXing reads it: @zxing/library 0.21 fails
 * on a few percent of valid symbols at any one scale (measured here with symbols straight from the
 * qrcode package; a gate pass's random token failed now and then at all of 96, 150, 200 and 300 dpi),
 * and a different scale or binarizer usually gets past it.
 */
export async function readQrOfPdf(pdf: Uint8Array, name: string): Promise<string> {
  let last: unknown
  for (const dpi of [96, 120, 150, 180, 200, 240, 300, 360]) {
    try {
      return await readQr(await renderFirstPage(pdf, name, dpi))
    } catch (err) {
      last = err
    }
  }
  throw last
}
