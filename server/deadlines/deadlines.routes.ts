import { Router, type Request, type Response } from 'express'
import { z } from 'zod'
import type { Database } from '@db/client'
import { calendarFeedSchema, DEADLINE_KINDS, deadlineQuerySchema } from '@shared/schemas/deadlines'
import { boardYardOf } from '../board/index'
import { publicBase } from '../documents/index'
import { notFound } from '../errors'
import { feedOf, feedOwner, renewFeed, revokeFeed } from './calendar-feeds'
import { deadlinesCalendar } from './deadlines-ics'
import { yardDeadlines } from './deadlines.service'

const tokenParams = z.object({ token: z.string() })

/**
 * GET /api/deadlines (the page), /api/deadlines.ics (the same as a calendar, signed in), the signed-in
 * person's own feed (/api/deadlines/feed: see, renew, withdraw) and the feed itself at its secret
 * address, /api/calendar/:token/deadlines.ics, which reaches that one calendar and nothing else.
 */
export function deadlinesRouter(db: Database, publicUrl?: string): Router {
  const router = Router()
  const calendar = async (req: Request, res: Response, userId: string) => {
    const yard = await boardYardOf(db, userId)
    const list = await yardDeadlines(db, yard, DEADLINE_KINDS)
    const base = publicBase(req, publicUrl)
    res
      .set({ 'cache-control': 'private, no-store', 'content-disposition': 'inline; filename="holdfast-deadlines.ics"' })
      .type('text/calendar; charset=utf-8')
      .send(deadlinesCalendar(list, yard.name, (id) => `${base}/vehicles/${id}`))
  }
  router.get('/deadlines', async (req, res) => {
    const { kind } = deadlineQuerySchema.parse(req.query)
    res.json(await yardDeadlines(db, await boardYardOf(db, req.user!.id), kind))
  })
  router.get('/deadlines.ics', (req, res) => calendar(req, res, req.user!.id))
  router.get('/deadlines/feed', async (req, res) => {
    res.json(calendarFeedSchema.parse(await feedOf(db, req.user!.id)))
  })
  router.post('/deadlines/feed', async (req, res) => {
    const { feed, token } = await renewFeed(db, req.user!.id)
    res.set('cache-control', 'no-store').status(201).json({ ...feed, url: `${publicBase(req, publicUrl)}/api/calendar/${token}/deadlines.ics` })
  })
  router.delete('/deadlines/feed', async (req, res) => {
    await revokeFeed(db, req.user!.id)
    res.status(204).end()
  })
  router.get('/calendar/:token/deadlines.ics', async (req, res) => {
    const owner = await feedOwner(db, tokenParams.parse(req.params).token)
    if (!owner) throw notFound('That calendar')
    await calendar(req, res, owner.id)
  })
  return router
}
