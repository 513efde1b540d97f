import { Router } from 'express'
import { vinDecodeParamsSchema } from '@shared/schemas/vin-decode'
import { decodeVin } from './vin-decode.service'

/** GET /api/vin-decode/:vin — year, make, model, body class and GVWR class from NHTSA vPIC, offline. */
export function vinDecodeRouter(): Router {
  const router = Router()
  router.get('/:vin', async (req, res) => {
    const { vin } = vinDecodeParamsSchema.parse(req.params)
    res.json(await decodeVin(vin))
  })
  return router
}
