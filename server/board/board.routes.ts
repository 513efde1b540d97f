import { Router } from 'express'
import type { Database } from '@db/client'
import { boardYardOf } from './board-cards'
import { boardEvents, type StreamTiming } from './board-events'
import type { BoardHub } from './board-hub'

export function boardRouter(db: Database, hub: BoardHub, timing?: StreamTiming): Router {
  const router = Router()
  router.get('/', async (req, res) => {
    const body = await hub.boardBody(await boardYardOf(db, req.user!.id))
    // Revalidated on every load: res.send answers 304 itself when the board has not changed.
    res.set({ 'cache-control': 'private, no-cache', etag: body.etag, vary: 'accept-encoding' }).type('application/json')
    if (req.fresh) return void res.status(304).end()
    if (req.acceptsEncodings('gzip') === 'gzip') res.set('content-encoding', 'gzip').send(await body.gzip())
    else res.send(body.json)
  })
  router.get('/events', boardEvents(db, hub, timing))
  return router
}
