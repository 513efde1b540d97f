import { pipeline } from 'node:stream/promises'
import { Router } from 'express'
import type { Database } from '@db/client'
import { agedSchema, receivablesQuerySchema, receivablesSchema } from '@shared/schemas/reports'
import { agedInventory } from './aged.service'
import { csvStream } from './csv'
import { lotOf } from './lot'
import { receivablesCsv } from './receivables-csv'
import { receivablesPage, receivableRows } from './receivables.service'

/**
 * The office's reports (permission `reports`): receivables (a page of rows with the totals of all, and
 * the same rows as CSV), the aged inventory.
 */
export function reportsRouter(db: Database): Router {
  const router = Router()
  router.get('/receivables', async (req, res) => {
    const q = receivablesQuerySchema.parse(req.query)
    const asOf = new Date()
    const { yard, cards } = await lotOf(db, req.user!.id, asOf)
    res.set('cache-control', 'private, no-store').json(receivablesSchema.parse(receivablesPage(receivableRows(cards, q), q, asOf, yard.timeZone)))
  })
  router.get('/receivables.csv', async (req, res) => {
    const q = receivablesQuerySchema.parse(req.query)
    const asOf = new Date()
    const { yard, cards } = await lotOf(db, req.user!.id, asOf)
    const day = asOf.toISOString().slice(0, 10)
    res.set({
      'content-type': 'text/csv; charset=utf-8',
      'cache-control': 'private, no-store',
      'content-disposition': `attachment; filename="receivables-${day}.csv"`,
      'x-time-zone': yard.timeZone,
    })
    await pipeline(csvStream(receivablesCsv(receivableRows(cards, q))), res)
  })
  router.get('/aged', async (req, res) => {
    const asOf = new Date()
    const { yard, cards } = await lotOf(db, req.user!.id, asOf)
    res.set('cache-control', 'private, no-store').json(agedSchema.parse(agedInventory(cards, yard.timeZone, asOf)))
  })
  return router
}
