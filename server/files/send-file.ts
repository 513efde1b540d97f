import type { Request, Response } from 'express'
import type { Database } from '@db/client'
import type { FileKind } from '@shared/schemas/files'
import { notFound } from '../errors'
import { FileMissingError, type FileStore } from './file-store'
import { fileOfVehicle, type FoundFile } from './files.queries'

/** One stored file (or its thumbnail) to the browser, or 404 when there is none. */
export async function streamFile(store: FileStore, req: Request, res: Response, found: FoundFile | undefined, thumb: boolean): Promise<void> {
  const key = thumb ? found?.file.thumbKey : found?.file.storageKey
  if (!found || !key) throw notFound('That file')
  const { file, stockNumber } = found
  // A file id never names other bytes, but the browser asks each time (no-cache): after signing out
  // on a shared yard computer, its cached photos are not shown again. The answer is a 304 with no bytes.
  const etag = `"${file.id}${thumb ? '-small' : ''}"`
  res.setHeader('ETag', etag)
  res.setHeader('Cache-Control', 'private, no-cache')
  if (req.headers['if-none-match'] === etag) {
    res.status(304).end()
    return
  }
  const opened = await store.get(key).catch((err) => {
    if (err instanceof FileMissingError) throw notFound('That file')
    throw err
  })
  const ext = file.mime === 'application/pdf' ? 'pdf' : 'jpg'
  const name = `${stockNumber}-${file.kind}-${file.id.slice(0, 8)}${thumb ? '-small' : ''}.${ext}`
  res.setHeader('Content-Type', thumb ? 'image/jpeg' : file.mime)
  res.setHeader('Content-Length', String(opened.bytes))
  // Images open in the page; a PDF is downloaded rather than rendered inside Holdfast's origin.
  res.setHeader('Content-Disposition', `${file.mime === 'application/pdf' ? 'attachment' : 'inline'}; filename="${name}"`)
  res.setHeader('X-Content-Type-Options', 'nosniff')
  res.setHeader('Content-Security-Policy', "default-src 'none'; sandbox")
  opened.stream.on('error', (err) => res.destroy(err))
  opened.stream.pipe(res)
}

/**
 * A file of one known vehicle, of the given kinds only, for a caller that has proved its right to
 * that vehicle another way (an owner link reaches its photos, never its IDs or papers).
 */
export async function sendVehicleFile(
  db: Database,
  store: FileStore,
  req: Request,
  res: Response,
  which: { vehicleId: string; fileId: string; thumb: boolean; kinds: readonly FileKind[] },
): Promise<void> {
  const found = await fileOfVehicle(db, which.vehicleId, which.fileId)
  await streamFile(store, req, res, found && which.kinds.includes(found.file.kind) ? found : undefined, which.thumb)
}
