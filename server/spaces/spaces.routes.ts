import { Router } from 'express'
import type { Database } from '@db/client'
import { vehicleParamsSchema } from '@shared/schemas/vehicles'
import { assignSpaceSchema } from '@shared/schemas/spaces'
import { notFound } from '../errors'
import type { VehicleChanges } from '../vehicles/index'
import { yardOfUser } from '../yards/index'
import { spacesOfYard } from './spaces.queries'
import { assignSpace } from './spaces.service'

/** GET /api/spaces — the yard's spaces and who is in each. */
export function spacesRouter(db: Database): Router {
  const router = Router()
  router.get('/', async (req, res) => {
    const yard = await yardOfUser(db, req.user!.id)
    if (!yard) throw notFound('A yard for your company')
    res.json({ spaces: await spacesOfYard(db, yard.id) })
  })
  return router
}

/** PUT /api/vehicles/:vehicleId/space */
export function vehicleSpaceRouter(changes: VehicleChanges): Router {
  const router = Router({ mergeParams: true })
  router.put('/', async (req, res) => {
    const { vehicleId } = vehicleParamsSchema.parse(req.params)
    res.json(await assignSpace(changes, req.user!, vehicleId, assignSpaceSchema.parse(req.body)))
  })
  return router
}
