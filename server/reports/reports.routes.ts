import { pipeline } from 'node:stream/promises'
import { Router } from 'express'
import type { Database } from '@db/client'
import { isoDate, localDay } from '@shared/domain/time'
import type { BoardHub } from '../board/index'
import { agedQuerySchema, agedSchema, dailyQuerySchema, dailyReportSchema, receivablesQuerySchema, receivablesSchema, salvageQuerySchema, salvageSchema } from '@shared/schemas/reports'
import { sendPdf } from '../documents/index'
import { notFound } from '../errors'
import { yardOfUser } from '../yards/index'
import { agedInventory } from './aged.service'
import { dailyReportPdf } from './daily-pdf'
import { dailyReport } from './daily.service'
import { csvStream } from './csv'
import { lotOf } from './lot'
import { receivablesCsv } from './receivables-csv'
import { salvageCsv } from './salvage-csv'
import { salvageInventoryPdf } from './salvage-pdf'
import { salvageInventory } from './salvage.service'
import { receivablesPage, receivableRows } from './receivables.service'

/**
 * The office's reports (permission `reports`): receivables (a page of rows with the totals of all, and
 * the same rows as CSV), the aged inventory, the daily report (JSON and PDF), the monthly salvage
 * inventory of 28 CFR 25.56 (JSON, CSV and PDF).
 */
export function reportsRouter(db: Database, hub: BoardHub): Router {
  const router = Router()
  router.get('/receivables', async (req, res) => {
    const q = receivablesQuerySchema.parse(req.query)
    const { yard, asOf, cards } = await lotOf(db, hub, req.user!.id)
    res.set('cache-control', 'private, no-store').json(receivablesSchema.parse(receivablesPage(receivableRows(cards, q), q, asOf, yard.timeZone)))
  })
  router.get('/receivables.csv', async (req, res) => {
    const q = receivablesQuerySchema.parse(req.query)
    const { yard, asOf, cards } = await lotOf(db, hub, req.user!.id)
    const day = isoDate(localDay(yard.timeZone, asOf.getTime()))
    res.set({
      'content-type': 'text/csv; charset=utf-8',
      'cache-control': 'private, no-store',
      'content-disposition': `attachment; filename="receivables-${day}.csv"`,
      'x-time-zone': yard.timeZone,
    })
    await pipeline(csvStream(receivablesCsv(receivableRows(cards, q))), res)
  })
  router.get('/aged', async (req, res) => {
    const q = agedQuerySchema.parse(req.query)
    const { yard, asOf, cards } = await lotOf(db, hub, req.user!.id)
    res.set('cache-control', 'private, no-store').json(agedSchema.parse(agedInventory(cards, q, yard.timeZone, asOf)))
  })
  router.get('/daily', async (req, res) => {
    const { date } = dailyQuerySchema.parse(req.query)
    res.set('cache-control', 'private, no-store').json(dailyReportSchema.parse(await dailyReport(db, req.user!, date)))
  })
  router.get('/daily.pdf', async (req, res) => {
    const { date, lang } = dailyQuerySchema.parse(req.query)
    const yard = await yardOfUser(db, req.user!.id)
    if (!yard) throw notFound('A yard for your company')
    const now = new Date()
    const report = await dailyReport(db, req.user!, date, now)
    sendPdf(res, await dailyReportPdf(report, yard, lang, now), `daily-report-${report.date}.pdf`)
  })
  router.get('/salvage', async (req, res) => {
    const { month } = salvageQuerySchema.parse(req.query)
    res.set('cache-control', 'private, no-store').json(salvageSchema.parse(await salvageInventory(db, req.user!.id, month)))
  })
  router.get('/salvage.csv', async (req, res) => {
    const { month } = salvageQuerySchema.parse(req.query)
    const report = await salvageInventory(db, req.user!.id, month)
    res.set({ 'content-type': 'text/csv; charset=utf-8', 'cache-control': 'private, no-store', 'content-disposition': `attachment; filename="salvage-inventory-${report.month}.csv"` })
    await pipeline(csvStream(salvageCsv(report.rows)), res)
  })
  router.get('/salvage.pdf', async (req, res) => {
    const { month, lang } = salvageQuerySchema.parse(req.query)
    const yard = await yardOfUser(db, req.user!.id)
    if (!yard) throw notFound('A yard for your company')
    const report = await salvageInventory(db, req.user!.id, month)
    sendPdf(res, await salvageInventoryPdf(report, yard, lang, new Date()), `salvage-inventory-${report.month}.pdf`)
  })
  return router
}
