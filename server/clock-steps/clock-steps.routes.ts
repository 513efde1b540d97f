import { Router } from 'express'
import { vehicleParamsSchema } from '@shared/schemas/vehicles'
import type { VehicleChanges } from '../vehicles/index'
import { clockStepsPage, recordClockStep } from './clock-steps.service'

/** Mounted at /api/vehicles/:vehicleId/clock-events: the lien-sale steps only the office can witness. */
export function clockStepsRouter({ changes }: { changes: VehicleChanges }): Router {
  const { db } = changes
  const router = Router({ mergeParams: true })
  router.get('/', async (req, res) => {
    const { vehicleId } = vehicleParamsSchema.parse(req.params)
    res.json(await clockStepsPage(db, req.user!, vehicleId))
  })
  router.post('/', async (req, res) => {
    const { vehicleId } = vehicleParamsSchema.parse(req.params)
    await recordClockStep(changes, req.user!, vehicleId, req.body)
    res.status(201).json(await clockStepsPage(db, req.user!, vehicleId))
  })
  return router
}
