import { Router } from 'express'
import { z } from 'zod'
import type { Database } from '@db/client'
import { vehicleParamsSchema } from '@shared/schemas/vehicles'
import { holdInputSchema, liftHoldSchema } from '@shared/schemas/holds'
import { holdsOf } from '../vehicles/index'
import { liftHold, setHold } from './holds.service'

const holdParam = vehicleParamsSchema.extend({ holdId: z.uuid({ error: 'That is not a hold id.' }) })

/** POST /api/vehicles/:vehicleId/holds and …/holds/:holdId/lift */
export function holdsRouter(db: Database): Router {
  const router = Router({ mergeParams: true })
  router.post('/', async (req, res) => {
    const { vehicleId } = vehicleParamsSchema.parse(req.params)
    await setHold(db, req.user!, vehicleId, holdInputSchema.parse(req.body))
    res.status(201).json({ holds: await holdsOf(db, vehicleId) })
  })
  router.post('/:holdId/lift', async (req, res) => {
    const { vehicleId, holdId } = holdParam.parse(req.params)
    await liftHold(db, req.user!, vehicleId, holdId, liftHoldSchema.parse(req.body))
    res.json({ holds: await holdsOf(db, vehicleId) })
  })
  return router
}
