import { Router } from 'express'
import { policeNoticeInputSchema } from '@shared/schemas/police-notices'
import { vehicleParamsSchema } from '@shared/schemas/vehicles'
import type { VehicleChanges } from '../vehicles/index'
import { recordPoliceNotice } from './police-notices.service'

/** POST /api/vehicles/:vehicleId/police-notice: the police were told of the tow. */
export function policeNoticeRouter(changes: VehicleChanges): Router {
  const router = Router({ mergeParams: true })
  router.post('/', async (req, res) => {
    const { vehicleId } = vehicleParamsSchema.parse(req.params)
    res.status(201).json(await recordPoliceNotice(changes, req.user!, vehicleId, policeNoticeInputSchema.parse(req.body)))
  })
  return router
}
