import express, { type Express } from 'express'
import helmet from 'helmet'
import { pinoHttp } from 'pino-http'
import type { Logger } from 'pino'
import path from 'node:path'
import { existsSync } from 'node:fs'
import type { Database } from '../db/client'
import { enforceAccess } from './access'
import { archiveRouter } from './archive/index'
import { BoardHub, boardRouter, movesRouter } from './board/index'
import type { StreamTiming } from './board/board-events'
import { errorHandler, notFoundHandler } from './errors'
import { fakesRouter } from './fakes/fakes.routes'
import { filesRouter, vehicleFilesRouter, type FileStore } from './files/index'
import { holdsRouter } from './holds/index'
import { inspectionsRouter } from './inspections/index'
import { cspSources, LOCAL_MAP, mapRouter, usesLocalFakes, type MapConfig } from './map/index'
import { quotesRouter } from './quotes/quotes.routes'
import { ruleSetsRouter } from './rule-sets/rule-sets.routes'
import { healthRouter } from './health/health.routes'
import { memoryBus, registerBoardNotifier, type LiveBus } from './live/index'
import { csrfProtection } from './middleware/csrf'
import { currentUser } from './middleware/current-user'
import { refuseNulCharacters } from './middleware/no-nul'
import { sessionMiddleware } from './middleware/session'
import { sessionRouter, type SignInLimits } from './session/index'
import { spacesRouter, vehicleSpaceRouter } from './spaces/index'
import { usersRouter } from './users/index'
import { vehiclesRouter } from './vehicles/index'
import { vinDecodeRouter } from './vin-decode/index'
import { yardsRouter } from './yards/index'

export interface AppDeps {
  db: Database
  log: Logger
  sessionSecret: string
  version: string
  /** Served over HTTPS (directly or behind a proxy): Secure cookies, HSTS, upgrade-insecure-requests. */
  https?: boolean
  trustProxy?: string
  origins?: string[]
  signInLimits?: SignInLimits
  /** The built client (index.html and assets); absent in API tests. */
  clientDir?: string
  /** Uploaded photos and papers, kept outside any served folder. */
  files: FileStore
  /** Tile and geocoder URLs; the built-in stand-ins when absent. */
  map?: MapConfig
  /** Board changes between app servers: PostgreSQL LISTEN/NOTIFY, or in-process (the default). */
  live?: LiveBus
  /** How long a computed board is served before balances are worked out again (60 s). */
  boardBucketMs?: number
  boardStream?: StreamTiming
}

const DEFAULT_LIMITS: SignInLimits = { perAccount: 5, perIp: 50, windowMs: 15 * 60_000 }

export function createApp(deps: AppDeps): Express {
  const { db, log, files } = deps
  const map = deps.map ?? LOCAL_MAP
  const hub = new BoardHub(db, deps.live ?? memoryBus(), log, { bucketMs: deps.boardBucketMs })
  registerBoardNotifier(db, hub)
  const app = express()
  app.disable('x-powered-by')
  if (deps.trustProxy) app.set('trust proxy', deps.trustProxy)

  app.use(
    helmet({
      contentSecurityPolicy: {
        directives: {
          'default-src': ["'self'"],
          'img-src': ["'self'", 'data:', 'blob:', ...cspSources(map.tileUrl)],
          'connect-src': ["'self'", ...cspSources(map.geocoderUrl)],
          'font-src': ["'self'", 'data:'],
          'style-src': ["'self'", "'unsafe-inline'"],
          'frame-ancestors': ["'none'"],
          'base-uri': ["'none'"],
          'form-action': ["'self'"],
          // On a plain-HTTP yard LAN this directive would break every asset.
          'upgrade-insecure-requests': deps.https ? [] : null,
        },
      },
      strictTransportSecurity: deps.https ? { maxAge: 15_552_000 } : false,
    }),
  )
  app.use(pinoHttp({ logger: log, autoLogging: { ignore: (req) => req.url === '/api/health' } }))
  app.use(express.json({ limit: '1mb' }))
  app.use('/api', refuseNulCharacters)
  app.use('/api', sessionMiddleware(db, deps.sessionSecret, deps.https ?? false))
  app.use('/api', currentUser())
  app.use('/api', csrfProtection(deps.origins ?? []))
  app.use('/api', enforceAccess)

  app.use('/api/health', healthRouter(db, deps.version))
  app.use('/api/session', sessionRouter(db, deps.signInLimits ?? DEFAULT_LIMITS))
  app.use('/api/users', usersRouter(db))
  app.use('/api/yards', yardsRouter(db))
  app.use('/api/board', boardRouter(db, hub, deps.boardStream))
  // Before any /api/vehicles/:id router, so that "closed" is never read as a vehicle id.
  app.use('/api/vehicles/closed', archiveRouter(db))
  app.use('/api/vehicles/:id/moves', movesRouter(db))
  app.use('/api/vehicles/:id/inspection', inspectionsRouter(db, files))
  app.use('/api/rule-sets', ruleSetsRouter(db))
  app.use('/api/quotes', quotesRouter(db))
  app.use('/api/vehicles/:vehicleId/holds', holdsRouter(db))
  app.use('/api/vehicles/:vehicleId/space', vehicleSpaceRouter(db))
  app.use('/api/vehicles/:vehicleId/files', vehicleFilesRouter(db, files))
  app.use('/api/vehicles', vehiclesRouter(db, files))
  app.use('/api/files', filesRouter(db, files))
  app.use('/api/spaces', spacesRouter(db))
  app.use('/api/map', mapRouter(db, map))
  app.use('/api/vin-decode', vinDecodeRouter())
  if (usesLocalFakes(map)) app.use('/api/fakes', fakesRouter())
  app.use('/api', notFoundHandler)

  if (deps.clientDir && existsSync(path.join(deps.clientDir, 'index.html'))) serveClient(app, deps.clientDir)
  app.use(notFoundHandler)
  app.use(errorHandler(log))
  return app
}

function serveClient(app: Express, dir: string) {
  app.use(express.static(dir, { index: false, maxAge: '1h', setHeaders: longCacheForHashedAssets }))
  // Client-side routes all load the one page.
  app.get('/{*splat}', (_req, res) => {
    res.setHeader('Cache-Control', 'no-cache')
    res.sendFile(path.join(dir, 'index.html'))
  })
}

function longCacheForHashedAssets(res: express.Response, file: string) {
  if (file.includes(`${path.sep}assets${path.sep}`)) res.setHeader('Cache-Control', 'public, max-age=31536000, immutable')
}
