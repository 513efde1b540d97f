import { Router } from 'express'
import type { Database } from '@db/client'
import { glanceQuerySchema, glanceSchema } from '@shared/schemas/glance'
import type { BoardHub } from '../board/index'
import { yardGlance } from './glance.service'

/** The manager's yard at a glance (permission `admin`): one route computing the plan and the figures. */
export function glanceRouter(db: Database, hub: BoardHub): Router {
  const router = Router()
  router.get('/', async (req, res) => {
    const q = glanceQuerySchema.parse(req.query)
    res.set('cache-control', 'private, no-store').json(glanceSchema.parse(await yardGlance(db, hub, req.user!.id, q)))
  })
  return router
}
