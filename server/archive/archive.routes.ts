import { Router } from 'express'
import type { Database } from '@db/client'
import { archiveQuerySchema, type ArchivePage } from '@shared/schemas/archive'
import { boardYardOf } from '../board/index'
import { closedVehicles, countClosed } from './archive.queries'

/** Mounted at /api/vehicles/closed: closed vehicles stay findable with how they left. */
export function archiveRouter(db: Database): Router {
  const router = Router()
  router.get('/', async (req, res) => {
    const query = archiveQuerySchema.parse(req.query)
    const yard = await boardYardOf(db, req.user!.id)
    const filter = { yardId: yard.id, q: query.q, disposition: query.disposition }
    const rows = await closedVehicles(db, filter, { limit: query.pageSize, offset: (query.page - 1) * query.pageSize })
    const page: ArchivePage = {
      rows: rows.map((r) => ({ ...r, disposition: r.disposition!, arrivedAt: r.arrivedAt.toISOString(), closedAt: (r.closedAt ?? r.arrivedAt).toISOString() })),
      total: await countClosed(db, filter),
      page: query.page,
      pageSize: query.pageSize,
    }
    res.json(page)
  })
  return router
}
