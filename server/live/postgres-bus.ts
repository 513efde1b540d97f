import pg from 'pg'
import type { Logger } from 'pino'
import { boardChangeSchema, sessionsEndedSchema, type BoardChange, type LiveBus, type LiveListener, type SessionsEnded } from './live-bus'

const CHANNEL = 'holdfast_board'
const SESSIONS_CHANNEL = 'holdfast_sessions'
const RETRY_MS = [250, 1_000, 3_000, 10_000]

/**
 * LISTEN/NOTIFY on one PostgreSQL database: every app server hears every change, in commit order.
 * The listening connection is its own client (a pooled one would be handed to other queries);
 * when it drops, listeners are told they may have missed changes once it is back.
 */
export async function postgresBus(url: string, log: Pick<Logger, 'warn'>): Promise<LiveBus> {
  const listeners = new Set<LiveListener>()
  const publisher = new pg.Pool({ connectionString: url, max: 2 })
  let listener: pg.Client | null = null
  let closing = false
  let attempt = 0

  function hear(msg: pg.Notification) {
    if (msg.channel === SESSIONS_CHANNEL) {
      const ended = sessionsEndedSchema.safeParse(JSON.parse(msg.payload ?? 'null'))
      if (!ended.success) return log.warn({ payload: msg.payload }, 'ignored a malformed session end')
      for (const l of [...listeners]) l.sessionsEnded(ended.data)
      return
    }
    const parsed = boardChangeSchema.safeParse(JSON.parse(msg.payload ?? 'null'))
    if (!parsed.success) return log.warn({ payload: msg.payload }, 'ignored a malformed board change')
    for (const l of [...listeners]) l.change(parsed.data)
  }

  async function connect() {
    const client = new pg.Client({ connectionString: url })
    client.on('notification', hear)
    client.on('error', (err) => log.warn({ err }, 'board change listener lost its connection'))
    // Only an established listener reconnects on its own; a failed attempt is retried below.
    client.on('end', () => {
      if (listener !== client) return
      listener = null
      if (!closing) reconnectLater()
    })
    try {
      await client.connect()
      await client.query(`listen ${CHANNEL}`)
      await client.query(`listen ${SESSIONS_CHANNEL}`)
    } catch (err) {
      await client.end().catch(() => undefined)
      throw err
    }
    listener = client
    attempt = 0
  }

  function reconnectLater() {
    const wait = RETRY_MS[Math.min(attempt++, RETRY_MS.length - 1)]
    setTimeout(() => {
      if (closing) return
      connect().then(
        () => listeners.forEach((l) => l.lost()),
        (err) => {
          log.warn({ err }, 'board change listener could not reconnect')
          reconnectLater()
        },
      )
    }, wait).unref()
  }

  await connect()
  return {
    async publish(change: BoardChange) {
      await publisher.query('select pg_notify($1, $2)', [CHANNEL, JSON.stringify(change)])
    },
    async endSessions(ended: SessionsEnded) {
      await publisher.query('select pg_notify($1, $2)', [SESSIONS_CHANNEL, JSON.stringify(ended)])
    },
    subscribe(l) {
      listeners.add(l)
      return () => listeners.delete(l)
    },
    async close() {
      closing = true
      for (const l of [...listeners]) l.closed()
      listeners.clear()
      await listener?.end()
      await publisher.end()
    },
  }
}
