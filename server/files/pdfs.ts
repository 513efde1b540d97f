import { createRequire } from 'node:module'
import { Worker } from 'node:worker_threads'
import type { FieldParams } from '@shared/schemas/field-messages'
import { MAX_PDF_OBJECTS, MAX_PDF_PAGES } from '@shared/schemas/files'
import type { FileRefusal } from './refusal'

export class UnreadablePdfError extends Error {}

/** A PDF refused for what opening it would cost, with the words for the person who sent it (and their code). */
export class CostlyPdfError extends Error {
  constructor(
    readonly code: FileRefusal['code'],
    message: string,
    readonly params?: FieldParams,
  ) {
    super(message)
  }
}

/** How long one PDF may take to open and re-save, and the heap its worker may use. */
export const PDF_LIMITS = { seconds: 10, heapMb: 192 }

// Entries that carry who made the file, or actions a viewer would run on opening it.
const CATALOG_KEYS = ['Metadata', 'OpenAction', 'AA', 'Names']

/*
 * The worker's own code, plain CommonJS run with `eval`: it needs no build step, so it is the same
 * under tsx, vitest and the esbuild bundle. pdf-lib is required by the absolute path resolved here.
 * It counts the objects from the bytes first (markers of plain objects plus the count each object
 * stream declares), so a crafted file is refused before the parser spends a minute on it; then the
 * pages and objects pdf-lib actually found; then strips the catalog entries and re-saves.
 */
const WORKER = `
const { parentPort, workerData } = require('node:worker_threads')
const { input, pdfLib, maxObjects, maxPages, catalogKeys } = workerData
async function run() {
  const bytes = Buffer.from(input.buffer, input.byteOffset, input.byteLength)
  const text = bytes.toString('latin1')
  let objects = 0
  const marker = /\\d+\\s+\\d+\\s+obj\\b/g
  while (marker.exec(text) && objects <= maxObjects) objects++
  const streams = /\\/Type\\s*\\/ObjStm\\b[^>]*?\\/N\\s+(\\d+)|\\/N\\s+(\\d+)[^>]*?\\/Type\\s*\\/ObjStm\\b/g
  for (let m; objects <= maxObjects && (m = streams.exec(text)); ) objects += Number(m[1] ?? m[2])
  if (objects > maxObjects) return { ok: false, reason: 'objects' }
  const { PDFDocument, PDFName } = require(pdfLib)
  let doc
  try {
    doc = await PDFDocument.load(bytes, { updateMetadata: false })
  } catch (err) {
    return { ok: false, reason: 'unreadable', detail: String(err && err.message) }
  }
  if (doc.context.enumerateIndirectObjects().length > maxObjects) return { ok: false, reason: 'objects' }
  const pages = doc.getPageCount()
  if (pages > maxPages) return { ok: false, reason: 'pages', pages }
  for (const key of catalogKeys) doc.catalog.delete(PDFName.of(key))
  doc.context.trailerInfo.Info = undefined
  return { ok: true, data: await doc.save({ updateFieldAppearances: false }) }
}
run().then(
  (r) => parentPort.postMessage(r, r.data ? [r.data.buffer] : []),
  (err) => parentPort.postMessage({ ok: false, reason: 'unreadable', detail: String(err && err.message) }),
)
`

type Outcome = { ok: true; data: Uint8Array } | { ok: false; reason: 'objects' | 'unreadable' | 'time' | 'memory' } | { ok: false; reason: 'pages'; pages: number }

const pdfLibPath = () => createRequire(import.meta.url).resolve('pdf-lib')

// One PDF opened at a time in the process: on a two-core server the other core keeps answering.
let queue: Promise<unknown> = Promise.resolve()
function oneAtATime<T>(work: () => Promise<T>): Promise<T> {
  const run = queue.then(work, work)
  queue = run.catch(() => undefined)
  return run
}

function inWorker(input: Buffer): Promise<Outcome> {
  return new Promise((resolve) => {
    const worker = new Worker(WORKER, {
      eval: true,
      workerData: { input: new Uint8Array(input), pdfLib: pdfLibPath(), maxObjects: MAX_PDF_OBJECTS, maxPages: MAX_PDF_PAGES, catalogKeys: CATALOG_KEYS },
      resourceLimits: { maxOldGenerationSizeMb: PDF_LIMITS.heapMb, maxYoungGenerationSizeMb: 32 },
    })
    let settled = false
    const settle = (o: Outcome) => {
      if (settled) return
      settled = true
      clearTimeout(timer)
      void worker.terminate()
      resolve(o)
    }
    const timer = setTimeout(() => settle({ ok: false, reason: 'time' }), PDF_LIMITS.seconds * 1000)
    worker.once('message', (o: Outcome) => settle(o))
    worker.once('error', (err: Error & { code?: string }) => settle({ ok: false, reason: err.code === 'ERR_WORKER_OUT_OF_MEMORY' ? 'memory' : 'unreadable' }))
    worker.once('exit', () => settle({ ok: false, reason: 'unreadable' }))
  })
}

/**
 * Re-saves a PDF without its document information, XMP metadata and open actions, in a worker
 * thread bounded in objects, pages, time and memory, so a crafted file cannot stall other requests.
 */
export async function cleanPdf(input: Buffer): Promise<Buffer> {
  const outcome = await oneAtATime(() => inWorker(input))
  if (outcome.ok) return Buffer.from(outcome.data.buffer, outcome.data.byteOffset, outcome.data.byteLength)
  switch (outcome.reason) {
    case 'objects': {
      const max = MAX_PDF_OBJECTS.toLocaleString('en-US')
      throw new CostlyPdfError('files.pdfParts', `The PDF has more than ${max} parts; a scan or form this complex cannot be accepted. Print it to a new PDF, or photograph the pages.`, { max })
    }
    case 'pages':
      throw new CostlyPdfError('files.pdfPages', `The PDF has ${outcome.pages} pages; at most ${MAX_PDF_PAGES} are accepted. Split it into parts.`, { pages: outcome.pages, max: MAX_PDF_PAGES })
    case 'time':
      throw new CostlyPdfError('files.pdfSlow', `The PDF took more than ${PDF_LIMITS.seconds} s to open. Print it to a new PDF, or photograph the pages.`, { seconds: PDF_LIMITS.seconds })
    case 'memory':
      throw new CostlyPdfError('files.pdfMemory', 'The PDF needs too much memory to open. Print it to a new PDF, or photograph the pages.')
    default:
      throw new UnreadablePdfError('unreadable')
  }
}
