import type { RequestHandler } from 'express'
import type { Database } from '@db/client'
import { AppError, said } from '../errors'
import { sessionKey } from '../live/index'
import { boardYardOf } from './board-cards'
import type { BoardHub } from './board-hub'
import { STREAMS_PER_SESSION } from './session-streams'

export interface StreamTiming {
  /** A comment line now and then keeps proxies and the browser from dropping a quiet stream. */
  heartbeatMs: number
  /** The stream ends after this long and the browser reconnects (resuming from Last-Event-ID). */
  lifetimeMs: number
}

const DEFAULT_TIMING: StreamTiming = { heartbeatMs: 20_000, lifetimeMs: 5 * 60_000 }
// EventSource waits this long before reconnecting by itself.
const RETRY_MS = 2_000

const TOO_MANY_STREAMS =
  `This sign-in already has ${STREAMS_PER_SESSION} live board connections open, the most it may. ` +
  'Close Holdfast in another tab or window and this board will connect.'

/** GET /api/board/events: Server-Sent Events with every change to the signed-in yard's board. */
export function boardEvents(db: Database, hub: BoardHub, timing: StreamTiming = DEFAULT_TIMING): RequestHandler {
  return async (req, res) => {
    const yard = await boardYardOf(db, req.user!.id)
    let open = true
    let stop = () => {}
    const end = () => {
      if (!open) return
      open = false
      stop()
      res.end()
    }
    // Ended at once when its session ends (signed out, deactivated, new role or password), on any server.
    const release = hub.holdStream({ sessionKey: sessionKey(req.sessionID), userId: req.user!.id }, end)
    if (!release) throw new AppError(429, TOO_MANY_STREAMS, said('tooManyStreams', { n: STREAMS_PER_SESSION }))
    const since = req.get('last-event-id') || (typeof req.query.since === 'string' ? req.query.since.slice(0, 60) : undefined)
    res.writeHead(200, {
      'content-type': 'text/event-stream; charset=utf-8',
      'cache-control': 'no-store, no-transform',
      connection: 'keep-alive',
      // nginx and similar proxies buffer responses unless told not to.
      'x-accel-buffering': 'no',
    })
    res.write(`retry: ${RETRY_MS}\n\n`)
    const unsubscribe = hub.subscribe(yard, { write: (chunk) => res.write(chunk), end }, since)
    // Each heartbeat also looks the session up again, in case its end was not heard (a session
    // that expired, a bus that was down): the stream ends within a heartbeat, not at its lifetime.
    const heartbeat = setInterval(() => {
      res.write(': keep-alive\n\n')
      req.sessionStore.get(req.sessionID, (err, current) => {
        if (!err && current?.user?.id !== req.user!.id) end()
      })
    }, timing.heartbeatMs)
    const lifetime = setTimeout(end, timing.lifetimeMs)
    stop = () => {
      clearInterval(heartbeat)
      clearTimeout(lifetime)
      unsubscribe()
      release()
    }
    req.on('close', end)
  }
}
