import { Router, type Request, type Response } from 'express'
import { z } from 'zod'
import type { Database } from '@db/client'
import { vehicleParamsSchema } from '@shared/schemas/vehicles'
import { uploadFieldsSchema } from '@shared/schemas/files'
import type { VehicleChanges } from '../vehicles/index'
import type { FileStore } from './file-store'
import { fileForUser, filesOf } from './files.queries'
import { streamFile } from './send-file'
import { addFiles } from './files.service'
import { receiveFiles } from './upload'
import { msg } from '@shared/schemas/field-messages'

const fileParam = z.object({ id: z.uuid({ error: msg('common.thatNotFileId', 'That is not a file id.') }) })

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
    await streamFile(store, req, res, found, thumb)
  }
  router.get('/:id', async (req, res) => send(req, res, fileParam.parse(req.params).id, false))
  router.get('/:id/thumb', async (req, res) => send(req, res, fileParam.parse(req.params).id, true))
  return router
}
