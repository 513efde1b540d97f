import { Router } from 'express'
import { moveRequestSchema } from '@shared/schemas/moves'
import { vehicleParamsSchema } from '@shared/schemas/vehicles'
import type { VehicleChanges } from '../vehicles/index'
import { moveVehicle } from './moves.service'

/** Mounted at /api/vehicles/:vehicleId/moves. */
export function movesRouter(changes: VehicleChanges): Router {
  const router = Router({ mergeParams: true })
  router.post('/', async (req, res) => {
    const { vehicleId } = vehicleParamsSchema.parse(req.params)
    res.json(await moveVehicle(changes, req.user!, vehicleId, moveRequestSchema.parse(req.body)))
  })
  return router
}
