import { Router, type Request } from 'express'
import { verifyVehicleHistory } from '@db/history'
import { searchQuerySchema } from '@shared/schemas/search'
import { correctVehicleSchema, towInSchema } from '@shared/schemas/tow-in'
import { vehicleParamsSchema, vehicleValueSchema } from '@shared/schemas/vehicles'
import { AppError, fieldIssue, said } from '../errors'
import { type FileStore, receiveFiles } from '../files/index'
import { correctVehicle } from './corrections.service'
import { intakeOptions } from './intake-options'
import { searchVehicles } from './search.queries'
import { createTowIn } from './tow-in.service'
import { recordValue } from './value.service'
import { historyEvents } from './vehicle-page.queries'
import { vehiclePage } from './vehicle-page.service'
import type { VehicleChanges } from './vehicle-change'
import { vehicleForUser } from './vehicles.queries'

/** A tow-in arrives as JSON, or as a form with the record in `data` and the photos in `photos`. */
function towInBody(req: Request): unknown {
  if (!req.is('multipart/form-data')) return req.body
  const raw = (req.body as { data?: unknown } | undefined)?.data
  try {
    return JSON.parse(typeof raw === 'string' ? raw : '')
  } catch {
    throw new AppError(400, 'The tow-in form did not arrive whole. Send it again.', said('towInNotWhole', undefined, { issues: [fieldIssue('data', 'vehicles.dataNotJson', 'Missing or not JSON.')] }))
  }
}

export function vehiclesRouter(changes: VehicleChanges, store: FileStore): Router {
  const { db } = changes
  const router = Router()
  router.get('/intake-options', async (req, res) => {
    res.json(await intakeOptions(db, req.user!.id))
  })
  router.get('/search', async (req, res) => {
    const { q } = searchQuerySchema.parse(req.query)
    res.json({ hits: await searchVehicles(db, req.user!.id, q) })
  })
  router.post('/', receiveFiles('photos'), async (req, res) => {
    const input = towInSchema.parse(towInBody(req))
    const photos = (req.files as Express.Multer.File[] | undefined) ?? []
    res.status(201).json(await createTowIn(changes, store, req.user!, input, photos))
  })
  router.get('/:vehicleId', async (req, res) => {
    res.json(await vehiclePage(db, req.user!.id, vehicleParamsSchema.parse(req.params).vehicleId))
  })
  router.patch('/:vehicleId', async (req, res) => {
    const { vehicleId } = vehicleParamsSchema.parse(req.params)
    res.json(await correctVehicle(changes, req.user!, vehicleId, correctVehicleSchema.parse(req.body)))
  })
  router.put('/:vehicleId/value', async (req, res) => {
    const { vehicleId } = vehicleParamsSchema.parse(req.params)
    res.json(await recordValue(changes, req.user!, vehicleId, vehicleValueSchema.parse(req.body)))
  })
  router.get('/:vehicleId/history', async (req, res) => {
    const { vehicleId } = vehicleParamsSchema.parse(req.params)
    await vehicleForUser(db, req.user!.id, vehicleId)
    res.json({ events: await historyEvents(db, vehicleId) })
  })
  // Recomputes every keyed link, the sealed head and the state: a row edited, added or removed behind
  // the app's back — even by the database's own administrator — shows here, in words.
  router.get('/:vehicleId/history/verify', async (req, res) => {
    const { vehicleId } = vehicleParamsSchema.parse(req.params)
    await vehicleForUser(db, req.user!.id, vehicleId)
    res.json(await verifyVehicleHistory(db, changes.historyKey, vehicleId))
  })
  return router
}
