import { Router, type Request } from 'express'
import { z } from 'zod'
import { vehicleParamsSchema } from '@shared/schemas/vehicles'
import { estimateLineSchema, itemCodeSchema, itemFindingSchema, rollAbilitySchema, valuesSchema } from '@shared/schemas/inspections'
import { type FileStore, receiveFiles } from '../files/index'
import type { VehicleChanges } from '../vehicles/index'
import { addLine, changeLine, removeLine, setValues } from './estimate.service'
import { addItemPhotos, setFinding } from './findings.service'
import { inspectionPage } from './inspection-page'
import { acknowledgeSafety, finishInspection, startInspection } from './inspections.service'
import { markRollAbility } from './roll-ability.service'
import { msg } from '@shared/schemas/field-messages'

const itemParam = vehicleParamsSchema.extend({ code: itemCodeSchema })
const lineParam = vehicleParamsSchema.extend({ lineId: z.uuid({ error: msg('common.thatNotEstimateLineId', 'That is not an estimate line id.') }) })

/**
 * Mounted at /api/vehicles/:vehicleId/inspection. Every change answers with the whole teardown page, so
 * the phone shows the totals, the recommendation and the pickup badge as the server worked them out.
 */
export function inspectionsRouter(changes: VehicleChanges, store: FileStore): Router {
  const { db } = changes
  const router = Router({ mergeParams: true })
  const page = (req: Request) => inspectionPage(db, req.user!.id, vehicleParamsSchema.parse(req.params).vehicleId)

  router.get('/', async (req, res) => {
    res.json(await page(req))
  })
  router.post('/', async (req, res) => {
    const { created } = await startInspection(changes, req.user!, vehicleParamsSchema.parse(req.params).vehicleId)
    res.status(created ? 201 : 200).json(await page(req))
  })
  router.post('/safety', async (req, res) => {
    await acknowledgeSafety(changes, req.user!, vehicleParamsSchema.parse(req.params).vehicleId)
    res.json(await page(req))
  })
  router.put('/items/:code', async (req, res) => {
    const { vehicleId, code } = itemParam.parse(req.params)
    await setFinding(changes, req.user!, vehicleId, code, itemFindingSchema.parse(req.body))
    res.json(await page(req))
  })
  router.post('/items/:code/photos', receiveFiles('files'), async (req, res) => {
    const { vehicleId, code } = itemParam.parse(req.params)
    await addItemPhotos(changes, store, req.user!, vehicleId, code, (req.files as Express.Multer.File[] | undefined) ?? [])
    res.status(201).json(await page(req))
  })
  router.post('/lines', async (req, res) => {
    await addLine(changes, req.user!, vehicleParamsSchema.parse(req.params).vehicleId, estimateLineSchema.parse(req.body))
    res.status(201).json(await page(req))
  })
  router.put('/lines/:lineId', async (req, res) => {
    const { vehicleId, lineId } = lineParam.parse(req.params)
    await changeLine(changes, req.user!, vehicleId, lineId, estimateLineSchema.parse(req.body))
    res.json(await page(req))
  })
  router.delete('/lines/:lineId', async (req, res) => {
    const { vehicleId, lineId } = lineParam.parse(req.params)
    await removeLine(changes, req.user!, vehicleId, lineId)
    res.json(await page(req))
  })
  router.put('/values', async (req, res) => {
    await setValues(changes, req.user!, vehicleParamsSchema.parse(req.params).vehicleId, valuesSchema.parse(req.body))
    res.json(await page(req))
  })
  router.patch('/roll-ability', async (req, res) => {
    await markRollAbility(changes, req.user!, vehicleParamsSchema.parse(req.params).vehicleId, rollAbilitySchema.parse(req.body))
    res.json(await page(req))
  })
  router.post('/finish', async (req, res) => {
    await finishInspection(changes, req.user!, vehicleParamsSchema.parse(req.params).vehicleId)
    res.json(await page(req))
  })
  return router
}
