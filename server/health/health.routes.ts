import { sql } from 'drizzle-orm'
import { Router } from 'express'
import type { Database } from '@db/client'

export function healthRouter(db: Database, version: string): Router {
  const router = Router()
  router.get('/', async (_req, res) => {
    const dbOk = await db.execute(sql`select 1`).then(() => true, () => false)
    res.status(dbOk ? 200 : 503).json({ status: dbOk ? 'ok' : 'degraded', db: dbOk ? 'ok' : 'down', version })
  })
  return router
}
