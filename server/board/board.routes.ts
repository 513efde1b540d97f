import { Router } from 'express'
import type { Database } from '../../db/client'
import { boardYardOf } from './board-cards'
import { boardEvents, type StreamTiming } from './board-events'
import type { BoardHub } from './board-hub'

export function boardRouter(db: Database, hub: BoardHub, timing?: StreamTiming): Router {
  const router = Router()
  router.get('/', async (req, res) => {
    const body = await hub.boardBody(await boardYardOf(db, req.user!.id))
    res.set('cache-control', 'no-store').type('application/json').send(body)
  })
  router.get('/events', boardEvents(db, hub, timing))
  return router
}
