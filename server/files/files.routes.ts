import { Router, type Request, type Response } from 'express'
import { z } from 'zod'
import type { Database } from '@db/client'
import { vehicleParamsSchema } from '@shared/schemas/vehicles'
import { uploadFieldsSchema } from '@shared/schemas/files'
import { notFound } from '../errors'
import type { VehicleChanges } from '../vehicles/index'
import { FileMissingError, type FileStore } from './file-store'
import { fileForUser, filesOf } from './files.queries'
import { addFiles } from './files.service'
import { receiveFiles } from './upload'

const fileParam = z.object({ id: z.uuid({ error: 'That is not a file id.' }) })

/** POST /api/vehicles/:vehicleId/files — photos, IDs and papers added to a vehicle's record. */
export function vehicleFilesRouter(changes: VehicleChanges, store: FileStore): Router {
  const { db } = changes
  const router = Router({ mergeParams: true })
  router.post('/', receiveFiles('files'), async (req, res) => {
    const { vehicleId } = vehicleParamsSchema.parse(req.params)
    const { kind, label } = uploadFieldsSchema.parse(req.body ?? {})
    const incoming = (req.files as Express.Multer.File[] | undefined) ?? []
    const ids = await addFiles(changes, store, req.user!, vehicleId, incoming, kind, label)
    res.status(201).json({ files: await filesOf(db, vehicleId, ids) })
  })
  return router
}

/** GET /api/files/:id and /api/files/:id/thumb — streamed only to signed-in staff of the company. */
export function filesRouter(db: Database, store: FileStore): Router {
  const router = Router()
  const send = async (req: Request, res: Response, id: string, thumb: boolean) => {
    const found = await fileForUser(db, req.user!.id, id)
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
  router.get('/:id', async (req, res) => send(req, res, fileParam.parse(req.params).id, false))
  router.get('/:id/thumb', async (req, res) => send(req, res, fileParam.parse(req.params).id, true))
  return router
}
