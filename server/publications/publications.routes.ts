import { Router } from 'express'
import { z } from 'zod'
import { publicationInputSchema } from '@shared/schemas/publications'
import { vehicleParamsSchema } from '@shared/schemas/vehicles'
import { msg } from '@shared/schemas/field-messages'
import { receiveFiles, type FileStore } from '../files/index'
import type { VehicleChanges } from '../vehicles/index'
import { saleDatePage, setSaleDate } from './sale-date.service'
import { addPublicationProof, publicationNoticeText, publicationsPage, recordPublication } from './publications.service'
import { documentLanguageQuerySchema } from '@shared/schemas/fields'

const publicationParams = vehicleParamsSchema.extend({ publicationId: z.uuid({ error: msg('common.thatNotPublicationId', 'That is not a publication id.') }) })

/** Mounted at /api/vehicles/:vehicleId/publications: the lien sale's newspaper notice. */
export function publicationsRouter({ changes, files }: { changes: VehicleChanges; files: FileStore }): Router {
  const { db } = changes
  const router = Router({ mergeParams: true })
  router.get('/', async (req, res) => {
    const { vehicleId } = vehicleParamsSchema.parse(req.params)
    res.json(await publicationsPage(db, req.user!, vehicleId))
  })
  router.post('/', async (req, res) => {
    const { vehicleId } = vehicleParamsSchema.parse(req.params)
    await recordPublication(changes, req.user!, vehicleId, publicationInputSchema.parse(req.body))
    res.status(201).json(await publicationsPage(db, req.user!, vehicleId))
  })
  router.get('/text', async (req, res) => {
    const { vehicleId } = vehicleParamsSchema.parse(req.params)
    const { lang } = documentLanguageQuerySchema.parse(req.query)
    const { text, stockNumber } = await publicationNoticeText(db, req.user!, vehicleId, lang)
    res.setHeader('Cache-Control', 'private, no-store')
    res.setHeader('Content-Disposition', `inline; filename="publication-${stockNumber}.txt"`)
    res.type('text/plain; charset=utf-8').send(text)
  })
  router.post('/:publicationId/proof', receiveFiles('files'), async (req, res) => {
    const { vehicleId, publicationId } = publicationParams.parse(req.params)
    await addPublicationProof(changes, files, req.user!, vehicleId, publicationId, (req.files as Express.Multer.File[] | undefined) ?? [])
    res.status(201).json(await publicationsPage(db, req.user!, vehicleId))
  })
  return router
}

/** Mounted at /api/vehicles/:vehicleId/sale-date: the lien sale's day, never earlier than the law allows. */
export function saleDateRouter({ changes }: { changes: VehicleChanges }): Router {
  const { db } = changes
  const router = Router({ mergeParams: true })
  router.get('/', async (req, res) => {
    const { vehicleId } = vehicleParamsSchema.parse(req.params)
    res.json(await saleDatePage(db, req.user!, vehicleId))
  })
  router.put('/', async (req, res) => {
    const { vehicleId } = vehicleParamsSchema.parse(req.params)
    await setSaleDate(changes, req.user!, vehicleId, req.body)
    res.json(await saleDatePage(db, req.user!, vehicleId))
  })
  return router
}
