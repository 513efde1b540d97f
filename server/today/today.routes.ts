import { Router } from 'express'
import type { Database } from '@db/client'
import { todaySchema } from '@shared/schemas/today'
import { todayOf } from './today.service'

/** GET /api/today: the signed-in person's work for today and this week, by their role. */
export function todayRouter(db: Database): Router {
  const router = Router()
  router.get('/', async (req, res) => {
    res.set('cache-control', 'private, no-store').json(todaySchema.parse(await todayOf(db, req.user!)))
  })
  return router
}
