import { Router } from 'express'
import type { Database } from '@db/client'
import { moveRequestSchema } from '@shared/schemas/moves'
import { vehicleParamsSchema } from '@shared/schemas/vehicles'
import { moveVehicle } from './moves.service'

/** Mounted at /api/vehicles/:vehicleId/moves. */
export function movesRouter(db: Database): Router {
  const router = Router({ mergeParams: true })
  router.post('/', async (req, res) => {
    const { vehicleId } = vehicleParamsSchema.parse(req.params)
    res.json(await moveVehicle(db, req.user!, vehicleId, moveRequestSchema.parse(req.body)))
  })
  return router
}
