import { createRequire } from 'node:module'
import { Worker } from 'node:worker_threads'

/** RGBA pixels of a HEIC/HEIF photo's primary image, turned upright as the file says. */
export interface DecodedHeic {
  data: Buffer
  width: number
  height: number
}

/** How long one photo may take to decode before its worker is ended. */
export const HEIC_LIMITS = { seconds: 20, heapMb: 256 }

/*
 * heic-decode wraps libheif compiled to WebAssembly, and its decode runs synchronously inside the
 * WebAssembly: on the request loop a 12-megapixel photo would hold every other request for about a
 * second. It runs in a worker of its own instead, kept between photos so libheif (several MB) is
 * compiled once, and ended (then made anew on the next photo) when a decode overruns or fails hard.
 * Plain CommonJS run with `eval`, like the PDF worker, so it is the same under tsx, vitest and the bundle.
 */
const WORKER = `
const { parentPort, workerData } = require('node:worker_threads')
const { all } = require(workerData.heicDecode)
parentPort.on('message', async ({ input, maxPixels }) => {
  try {
    const images = await all({ buffer: input })
    try {
      const primary = images[0]
      if (!primary) throw new Error('the file holds no image')
      if (primary.width * primary.height > maxPixels) throw new Error(primary.width + '×' + primary.height + ' is too large to open')
      const { data, width, height } = await primary.decode()
      // A copy of its own: the decoded pixels may be a view into libheif's memory, which cannot be moved.
      const pixels = new Uint8Array(data)
      parentPort.postMessage({ ok: true, data: pixels, width, height }, [pixels.buffer])
    } finally {
      images.dispose()
    }
  } catch (err) {
    parentPort.postMessage({ ok: false, message: String((err && err.message) || err) })
  }
})
`

type Outcome = { ok: true; data: Uint8Array; width: number; height: number } | { ok: false; message: string }

let worker: Worker | undefined
function heicWorker(): Worker {
  if (!worker) {
    worker = new Worker(WORKER, {
      eval: true,
      workerData: { heicDecode: createRequire(import.meta.url).resolve('heic-decode') },
      resourceLimits: { maxOldGenerationSizeMb: HEIC_LIMITS.heapMb },
    })
    // An idle decoder never keeps the server (or a test run) from ending.
    worker.unref()
  }
  return worker
}

function endWorker() {
  void worker?.terminate()
  worker = undefined
}

// One photo at a time: the worker answers in order, and a two-core server keeps its other core.
let queue: Promise<unknown> = Promise.resolve()
function oneAtATime<T>(work: () => Promise<T>): Promise<T> {
  const run = queue.then(work, work)
  queue = run.catch(() => undefined)
  return run
}

function decodeInWorker(input: Buffer, maxPixels: number): Promise<Outcome> {
  return new Promise((resolve) => {
    const w = heicWorker()
    const settle = (o: Outcome, end = false) => {
      clearTimeout(timer)
      w.off('message', onMessage).off('error', onError).off('exit', onExit)
      if (end) endWorker()
      resolve(o)
    }
    const onMessage = (o: Outcome) => settle(o)
    const onError = (err: Error) => settle({ ok: false, message: err.message }, true)
    const onExit = () => settle({ ok: false, message: 'the decoder stopped' }, true)
    const timer = setTimeout(() => settle({ ok: false, message: `took longer than ${HEIC_LIMITS.seconds} s to open` }, true), HEIC_LIMITS.seconds * 1000)
    w.on('message', onMessage).on('error', onError).on('exit', onExit)
    w.postMessage({ input: new Uint8Array(input), maxPixels })
  })
}

/**
 * Decodes a phone's HEIC photo, which the image library's prebuilt binaries cannot read (they
 * leave the HEVC codec out). The size is checked before the pixels are: `maxPixels` refuses a bomb.
 */
export async function decodeHeic(input: Buffer, maxPixels: number): Promise<DecodedHeic> {
  const outcome = await oneAtATime(() => decodeInWorker(input, maxPixels))
  if (!outcome.ok) throw new Error(outcome.message)
  return { data: Buffer.from(outcome.data.buffer, outcome.data.byteOffset, outcome.data.byteLength), width: outcome.width, height: outcome.height }
}
