import { sql } from 'drizzle-orm'
import { Router } from 'express'
import type { Database } from '@db/client'
import type { Readiness } from './readiness'

/**
 * GET /api/health (the database answers), /api/health/live (the process answers) and
 * /api/health/ready (send work here: see readiness.ts). Public, for load balancers and monitors:
 * they say what is working, never whose data is here.
 */
export function healthRouter(db: Database, version: string, ready: () => Promise<Readiness>): Router {
  const router = Router()
  router.get('/', async (_req, res) => {
    const dbOk = await db.execute(sql`select 1`).then(() => true, () => false)
    res.status(dbOk ? 200 : 503).json({ status: dbOk ? 'ok' : 'degraded', db: dbOk ? 'ok' : 'down', version })
  })
  router.get('/live', (_req, res) => {
    res.setHeader('Cache-Control', 'no-store')
    res.json({ status: 'ok' })
  })
  router.get('/ready', async (_req, res) => {
    const r = await ready()
    res.setHeader('Cache-Control', 'no-store')
    res.status(r.ready ? 200 : 503).json({ status: r.ready ? 'ready' : r.checks.draining ? 'draining' : 'not ready', checks: r.checks })
  })
  return router
}
