import { Router } from 'express'
import { z } from 'zod'
import { vehicleParamsSchema } from '@shared/schemas/vehicles'
import { holdInputSchema, liftHoldSchema } from '@shared/schemas/holds'
import { msg } from '@shared/schemas/field-messages'
import { holdsOf, type VehicleChanges } from '../vehicles/index'
import { liftHold, setHold } from './holds.service'

const holdParam = vehicleParamsSchema.extend({ holdId: z.uuid({ error: msg('common.thatNotHoldId', 'That is not a hold id.') }) })

/** POST /api/vehicles/:vehicleId/holds and …/holds/:holdId/lift */
export function holdsRouter(changes: VehicleChanges): Router {
  const { db } = changes
  const router = Router({ mergeParams: true })
  router.post('/', async (req, res) => {
    const { vehicleId } = vehicleParamsSchema.parse(req.params)
    await setHold(changes, req.user!, vehicleId, holdInputSchema.parse(req.body))
    res.status(201).json({ holds: await holdsOf(db, vehicleId) })
  })
  router.post('/:holdId/lift', async (req, res) => {
    const { vehicleId, holdId } = holdParam.parse(req.params)
    await liftHold(changes, req.user!, vehicleId, holdId, liftHoldSchema.parse(req.body))
    res.json({ holds: await holdsOf(db, vehicleId) })
  })
  return router
}
