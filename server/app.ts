import express, { type Express } from 'express'
import expressStaticGzip from 'express-static-gzip'
import helmet from 'helmet'
import { pinoHttp } from 'pino-http'
import type { Logger } from 'pino'
import path from 'node:path'
import { existsSync } from 'node:fs'
import type { ServerResponse } from 'node:http'
import type { Database } from '@db/client'
import type { HistoryKey } from '@db/history'
import { enforceAccess } from './access'
import { archiveRouter } from './archive/index'
import { deadlinesRouter } from './deadlines/index'
import { BoardHub, boardRouter, movesRouter, type StreamTiming } from './board/index'
import { cashDrawerRouter, vehicleBillingRouter } from './billing/index'
import { cardCheckoutsRouter, cardRefundsRouter, cardWebhookRouter, type CardPayments } from './card-payments/index'
import { contactsRouter, recordsRequestsRouter } from './contacts/index'
import { documentsRouter } from './documents/index'
import { errorHandler, notFoundHandler } from './errors'
import { fakesRouter } from './fakes/index'
import { firstRunRouter } from './first-run/index'
import { filesRouter, vehicleFilesRouter, type FileStore } from './files/index'
import { holdsRouter } from './holds/index'
import { inspectionsRouter } from './inspections/index'
import { cspSources, LOCAL_MAP, mapRouter, usesLocalFakes, type MapConfig } from './map/index'
import { dueNoticesRouter, noticesRouter } from './notices/index'
import { outboxRouter } from './outbox/index'
import { policeNoticeRouter } from './police-notices/index'
import { DEFAULT_PUBLIC_LIMITS, lookupRouter, ownerLinksRouter, ownerRouter, publicThrottle, type PublicLimits } from './owner/index'
import { quotesRouter } from './quotes/index'
import { gateRouter, releasesRouter } from './releases/index'
import { transfersRouter } from './transfers/index'
import { publicationsRouter, saleDateRouter } from './publications/index'
import { clockStepsRouter } from './clock-steps/index'
import { ruleSetsRouter } from './rule-sets/index'
import { holidaysRouter } from './holidays/index'
import { todayRouter } from './today/index'
import { reportsRouter } from './reports/index'
import { glanceRouter } from './glance/index'
import { Drain, healthRouter, readinessCheck } from './health/index'
import { logSerializers, safeLogger } from './logging'
import { type LiveBus, memoryBus } from './live/index'
import { anonymousCsrf, csrfProtection, currentUser, refuseNulCharacters, sessionMiddleware } from './middleware/index'
import { knownDevices, sessionRouter, type SignInLimits, signInThrottle } from './session/index'
import { spacesRouter, vehicleSpaceRouter } from './spaces/index'
import { usersRouter } from './users/index'
import { type VehicleChanges, vehiclesRouter } from './vehicles/index'
import { vinDecodeRouter } from './vin-decode/index'
import { yardsRouter } from './yards/index'
import { settingsRouter, vehicleRuleSetRouter } from './settings/index'
import { settingsAuditRouter } from './settings-audit/index'
import { yardSettingsRouter } from './yard-settings/index'

export interface AppDeps {
  db: Database
  /** Seals every history event and head; kept outside the database (server/history-key.ts). */
  historyKey: HistoryKey
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
  /** Tells the e-mail worker that a message waits (server/outbox/); absent, messages wait for its next poll. */
  kickOutbox?: () => void
  /** Where people reach Holdfast, for links and QR codes on documents; the request's own address when absent. */
  publicUrl?: string
  /** Days an owner link opens the owner's page (30). */
  ownerLinkDays?: number
  /** Tries per address on the public pages a stranger could guess at: owner codes, the vehicle lookup. */
  publicLimits?: PublicLimits
  /** The card payment service's SDK client and webhook secret (the local fake by default); absent, card pages answer 503. */
  cardPayments?: CardPayments
  /** Set when the server is shutting down: readiness answers 503, no new board stream opens. */
  drain?: Drain
  /** The committed migrations, for readiness to know the database has them all (db/migrations). */
  migrationsFolder?: string
}

const DEFAULT_LIMITS: SignInLimits = { perAccount: 5, perIp: 50, windowMs: 15 * 60_000 }

export function createApp(deps: AppDeps): Express {
  const { db, files } = deps
  const log = safeLogger(deps.log)
  const map = deps.map ?? LOCAL_MAP
  const hub = new BoardHub(db, deps.live ?? memoryBus(), log, { bucketMs: deps.boardBucketMs })
  // Everything that changes a vehicle gets the database and the boards to tell, from here only.
  const changes: VehicleChanges = { db, boards: hub, historyKey: deps.historyKey }
  const app = express()
  app.disable('x-powered-by')
  if (deps.trustProxy) app.set('trust proxy', deps.trustProxy)

  app.use(
    helmet({
      contentSecurityPolicy: {
        directives: {
          'default-src': ["'self'"],
          // The barcode scanner's reader is WebAssembly (served from 'self'): compiling it needs this, no eval.
          'script-src': ["'self'", "'wasm-unsafe-eval'"],
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
  app.use(pinoHttp({ logger: log, serializers: logSerializers, autoLogging: { ignore: (req) => req.url === '/api/health' || req.url?.startsWith('/api/health/') === true } }))
  const cards = { changes, cards: deps.cardPayments, mail: { kick: deps.kickOutbox }, publicUrl: deps.publicUrl }
  // The payment service's webhook: its raw bytes are what the signature covers, so it comes before the
  // JSON parser; no session and no CSRF token (the signature is its guard), but still the access table.
  app.use('/api/card-payments/webhook', enforceAccess, cardWebhookRouter(cards))
  app.use(express.json({ limit: '1mb' }))
  app.use('/api', refuseNulCharacters)
  app.use('/api', sessionMiddleware(db, deps.sessionSecret, deps.https ?? false))
  app.use('/api', currentUser())
  const anonymous = anonymousCsrf(deps.sessionSecret, deps.https ?? false)
  // Access first: a request whose session has ended is told so (401), not that its page is out of
  // date. Nothing is written either way; a signed-in request still needs its CSRF token after this.
  app.use('/api', enforceAccess)
  app.use('/api', csrfProtection(deps.origins ?? [], anonymous))

  const drain = deps.drain ?? new Drain()
  app.use('/api/health', healthRouter(db, deps.version, readinessCheck({ db, files, drain, migrationsFolder: deps.migrationsFolder ?? path.resolve('db/migrations') })))
  // A board stream opened while this server shuts down would be cut at once: the browser retries elsewhere.
  app.use('/api/board/events', (_req, res, next) => (drain.draining ? res.status(503).setHeader('Retry-After', '1').json({ error: 'This server is restarting; the board reconnects to another one.' }) : next()))
  const limits = deps.signInLimits ?? DEFAULT_LIMITS
  app.use(
    '/api/session',
    sessionRouter(db, { anonymous, devices: knownDevices(deps.sessionSecret, deps.https ?? false, limits.now), throttle: signInThrottle(db, limits, log), boards: hub }),
  )
  app.use('/api/first-run', firstRunRouter(db, map))
  app.use('/api/users', usersRouter(db, hub))
  app.use('/api/yards', yardsRouter(db))
  app.use('/api/board', boardRouter(db, hub, deps.boardStream))
  // Before any /api/vehicles/:id router, so that "closed" is never read as a vehicle id.
  app.use('/api/vehicles/closed', archiveRouter(db))
  app.use('/api/vehicles/:vehicleId/moves', movesRouter(changes))
  app.use('/api/vehicles/:vehicleId/inspection', inspectionsRouter(changes, files))
  app.use('/api/rule-sets', ruleSetsRouter(db))
  app.use('/api/quotes', quotesRouter(db))
  app.use('/api/settings/audit', settingsAuditRouter(db))
  app.use('/api/settings/yards', yardSettingsRouter(db))
  app.use('/api/settings', holidaysRouter())
  app.use('/api/settings', settingsRouter(db))
  app.use('/api/vehicles/:vehicleId/rule-set-version', vehicleRuleSetRouter(changes))
  app.use('/api/vehicles/:vehicleId/owner-links', ownerLinksRouter(changes, deps.ownerLinkDays ?? 30))
  app.use('/api/vehicles/:vehicleId/holds', holdsRouter(changes))
  app.use('/api/vehicles/:vehicleId/police-notice', policeNoticeRouter(changes))
  app.use('/api/vehicles/:vehicleId/contacts', contactsRouter(changes))
  app.use('/api/vehicles/:vehicleId/records-requests', recordsRequestsRouter(changes))
  app.use('/api/vehicles/:vehicleId/notices', noticesRouter({ changes, files, ownerLinkDays: deps.ownerLinkDays ?? 30, kick: deps.kickOutbox, publicUrl: deps.publicUrl }))
  app.use('/api/notices', dueNoticesRouter(db))
  app.use('/api/vehicles/:vehicleId/space', vehicleSpaceRouter(changes))
  app.use('/api/vehicles/:vehicleId/files', vehicleFilesRouter(changes, files))
  app.use('/api/vehicles/:vehicleId/documents', documentsRouter({ db, publicUrl: deps.publicUrl }))
  app.use('/api/vehicles/:vehicleId/card-checkouts', cardCheckoutsRouter(cards))
  app.use('/api/vehicles/:vehicleId/card-refunds', cardRefundsRouter(cards))
  app.use('/api/vehicles/:vehicleId', vehicleBillingRouter(changes, { kick: deps.kickOutbox }))
  app.use('/api/cash-drawer', cashDrawerRouter(db))
  app.use('/api/vehicles/:vehicleId/release', releasesRouter({ changes, files, publicUrl: deps.publicUrl }))
  app.use('/api/vehicles/:vehicleId/transfer', transfersRouter({ changes, files }))
  app.use('/api/vehicles/:vehicleId/publications', publicationsRouter({ changes, files }))
  app.use('/api/vehicles/:vehicleId/sale-date', saleDateRouter({ changes }))
  app.use('/api/vehicles/:vehicleId/clock-events', clockStepsRouter({ changes }))
  app.use('/api/gate', gateRouter(changes))
  app.use('/api/vehicles', vehiclesRouter(changes, files))
  app.use('/api/files', filesRouter(db, files))
  app.use('/api/spaces', spacesRouter(db))
  app.use('/api/map', mapRouter(db, map))
  app.use('/api/vin-decode', vinDecodeRouter())
  app.use('/api/outbox', outboxRouter({ db, files, kick: deps.kickOutbox }))
  app.use('/api/today', todayRouter(db))
  app.use('/api/reports', reportsRouter(db, hub))
  app.use('/api/glance', glanceRouter(db, hub))
  app.use('/api', deadlinesRouter(db, deps.publicUrl))
  // Public: the owner's page (its key checked by every route) and "is my vehicle here?".
  const throttle = publicThrottle(db, deps.publicLimits ?? DEFAULT_PUBLIC_LIMITS)
  app.use('/api/owner', ownerRouter({ changes, files, map, throttle, cardPayments: cards }))
  app.use('/api/vehicle-lookup', lookupRouter(db, throttle))
  if (usesLocalFakes(map)) app.use('/api/fakes', fakesRouter())
  app.use('/api', notFoundHandler)

  if (deps.clientDir && existsSync(path.join(deps.clientDir, 'index.html'))) serveClient(app, deps.clientDir)
  app.use(notFoundHandler)
  app.use(errorHandler(log))
  return app
}

function serveClient(app: Express, dir: string) {
  // The build writes a .br and a .gz beside each text asset; each request gets the smallest one its
  // browser accepts (Content-Encoding, Vary: Accept-Encoding), or the plain file.
  app.use(
    // It finds the compressed files once, at start, by paths under exactly this root.
    expressStaticGzip(path.resolve(dir), {
      enableBrotli: true,
      orderPreference: ['br', 'gzip'],
      index: false,
      serveStatic: { index: false, maxAge: '1h', setHeaders: longCacheForHashedAssets },
    }),
  )
  // Client-side routes all load the one page.
  app.get('/{*splat}', (_req, res) => {
    res.setHeader('Cache-Control', 'no-cache')
    res.sendFile(path.join(dir, 'index.html'))
  })
}

function longCacheForHashedAssets(res: ServerResponse, file: string) {
  if (file.includes(`${path.sep}assets${path.sep}`)) res.setHeader('Cache-Control', 'public, max-age=31536000, immutable')
}
