import { Router } from 'express'
import { z } from 'zod'
import type { Database } from '../../db/client'
import { moveRequestSchema } from '../../shared/schemas/moves'
import { moveVehicle } from './moves.service'

const params = z.object({ id: z.uuid({ error: 'That is not a vehicle id.' }) })

/** Mounted at /api/vehicles/:id/moves. */
export function movesRouter(db: Database): Router {
  const router = Router({ mergeParams: true })
  router.post('/', async (req, res) => {
    const { id } = params.parse(req.params)
    res.json(await moveVehicle(db, req.user!, id, moveRequestSchema.parse(req.body)))
  })
  return router
}
