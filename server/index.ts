import { pino } from 'pino'
import { openDatabase, DataDirLockedError, type DatabaseHandle } from '@db/client'
import { hasHistory, type HistoryKey } from '@db/history'
import { adoptDemoTemplate, demoSignIns, loadDemoIfEmpty, usableDemoTemplate, type DemoLoaded } from './demo/index'
import { createApp } from './app'
import { openFileStore } from './files/index'
import { addSampleWords } from './rule-sets/index'
import { Drain } from './health/index'
import { memoryBus, postgresBus } from './live/index'
import { loadConfig } from './config'
import { startFakePaymentService, startLocalSmtp } from './fakes/index'
import { cardPaymentsClient } from './card-payments/index'
import { OutboxWorker, smtpTransport } from './outbox/index'
import { pruneExpiredSessions, pruneSignInFailures, sessionSecret } from './session/index'
import { loadHistoryKey } from './history-key'
import { logSerializers } from './logging'
import { startupBanner } from './startup-banner'
import { appVersion } from './version'

const started = performance.now()
let config: ReturnType<typeof loadConfig>
try {
  config = loadConfig()
} catch (err) {
  console.error((err as Error).message)
  process.exit(78)
}
// Readable lines on a terminal, JSON lines for a log collector.
const log = pino({ level: config.logLevel, serializers: logSerializers, ...(process.stdout.isTTY ? { transport: { target: 'pino-pretty', options: { ignore: 'pid,hostname' } } } : {}) })

// A new embedded database with the demo starts from the build's demo template while its demo is recent.
const demoTemplate = config.demo && config.database.kind === 'pglite' ? usableDemoTemplate(`${config.demoTemplate}.json`) : null
let handle: DatabaseHandle
try {
  handle = await openDatabase(demoTemplate && config.database.kind === 'pglite' ? { ...config.database, template: config.demoTemplate } : config.database, config.migrationsFolder)
} catch (err) {
  if (err instanceof DataDirLockedError) {
    log.fatal(err.message)
    process.exit(75)
  }
  throw err
}
const opened = performance.now()
await handle.migrate()
const migrated = performance.now()
const { db } = handle
// Rule sets stored before the samples spoke Spanish get the samples' words (only words: server/rule-sets/sample-words.ts).
const worded = await addSampleWords(db, config.ruleSetsFolder)
if (worded > 0) log.info({ versions: worded }, "Added the sample rule sets' Spanish words to rule sets stored before them.")
let historyKey: HistoryKey
const files = await openFileStore(config)
let adopted: DemoLoaded | null = null
try {
  if (demoTemplate && handle.startedFrom === config.demoTemplate) {
    // Made from the demo template just now: this install's own key, and the demo re-sealed with it before anything is served.
    historyKey = loadHistoryKey(config.historyKeyFile, false)
    const resealStarted = performance.now()
    const made = await adoptDemoTemplate(db, historyKey, files, demoTemplate)
    adopted = made
    log.info({ ...made.resealed, ms: Math.round(performance.now() - resealStarted) }, 'Started from the demo template: its history is re-sealed with this install\'s key.')
  } else historyKey = loadHistoryKey(config.historyKeyFile, await hasHistory(db))
} catch (err) {
  log.fatal((err as Error).message)
  await handle.close()
  process.exit(78)
}
const loadedDemo = adopted ?? (config.demo ? await loadDemoIfEmpty(db, historyKey, new Date(), config.ruleSetsFolder, files) : null)
if (loadedDemo && !process.stdout.isTTY) log.info('Loaded the demo yard.')
// A returning person at a terminal is shown the demo sign-ins each time; a log collector only on the first load.
const demo = process.stdout.isTTY ? (loadedDemo ?? (config.demo ? await demoSignIns(db) : null)) : loadedDemo
if (demo && !process.stdout.isTTY) {
  log.info('Sign in with any of these (password: %s):', demo.password)
  for (const u of demo.users) log.info('  %s  %s', u.role.padEnd(10), u.email)
}

// Several app servers on one PostgreSQL hear each other's board changes; one embedded database has one server.
const live = config.database.kind === 'postgres' ? await postgresBus(config.database.url, log) : memoryBus()

// Mail goes to SMTP_URL, or to the local stand-in through the very same transport.
const localSmtp = config.mail.smtpUrl ? undefined : await startLocalSmtp({ folder: config.mail.localFolder })
if (localSmtp) log.info(`No SMTP_URL: e-mail goes to the local stand-in at ${localSmtp.url}, kept in ${config.mail.localFolder}`)
const drain = new Drain()
const outbox = new OutboxWorker(db, smtpTransport(config.mail.smtpUrl ?? localSmtp!.url), files, log, { from: config.mail.from })

// Card payments go to the payment service by its key, or to the local stand-in through the very same SDK.
const fakePayments = config.payments.kind === 'fake' ? await startFakePaymentService({ port: config.payments.port }) : undefined
if (fakePayments) log.info(`No STRIPE_SECRET_KEY: card payments go to the local stand-in at http://${fakePayments.host}:${fakePayments.port}`)
const cardPayments =
  config.payments.kind === 'service'
    ? cardPaymentsClient({ secretKey: config.payments.secretKey, webhookSecret: config.payments.webhookSecret })
    : cardPaymentsClient({ secretKey: fakePayments!.secretKey, webhookSecret: fakePayments!.webhookSecret, host: fakePayments!.host, port: fakePayments!.port })

const app = createApp({
  db,
  historyKey,
  log,
  version: appVersion(),
  sessionSecret: await sessionSecret(db, config.sessionSecret),
  https: config.https,
  trustProxy: config.trustProxy,
  origins: config.origins,
  clientDir: config.clientDir,
  signInLimits: config.signInLimits,
  ownerLinkDays: config.ownerLinkDays,
  publicLimits: config.publicLimits,
  live,
  files,
  map: config.map,
  kickOutbox: () => outbox.kick(),
  publicUrl: config.publicUrl,
  cardPayments,
  drain,
  migrationsFolder: config.migrationsFolder,
})
outbox.start()
// The stand-in's webhooks come to this server's own port, signed as the real service signs them.
fakePayments?.deliverTo(async (payload, signature) => {
  const r = await fetch(`http://127.0.0.1:${config.port}/api/card-payments/webhook`, { method: 'POST', headers: { 'content-type': 'application/json', 'stripe-signature': signature }, body: payload })
  return r.status
})

const server = app.listen(config.port, config.host, () => {
  const where = config.database.kind === 'postgres' ? 'PostgreSQL' : `embedded database in ${config.dataDir}`
  const url = `http://localhost:${config.port}`
  const readyMs = performance.now() - started
  if (process.stdout.isTTY) {
    console.log(startupBanner({ url, database: where, filesDir: files.where, historyKeyFile: config.historyKeyFile, demo, readyMs }))
  } else {
    log.info(`Holdfast is serving ${url} (${where}), ready in ${Math.round(readyMs)} ms`)
  }
  log.debug(`start-up: modules and database open ${Math.round(opened - started)} ms, migrations ${Math.round(migrated - opened)} ms`)
})

// Node closes an idle kept-alive connection after 5 s; a client (a browser, a proxy, a test's request
// context) that sends on it at that moment gets ECONNRESET. Idle connections are kept longer than the
// usual clients and proxies keep theirs (60 s), so the server is never the side that closes mid-send.
server.keepAliveTimeout = 65_000
server.headersTimeout = 66_000

// Expired sessions and sign-in counters go at start (after a long stop many have) and every 15 minutes after.
const prune = () =>
  void Promise.all([pruneExpiredSessions(db), pruneSignInFailures(db, config.signInLimits.windowMs)]).catch((err) => log.warn({ err }, 'session prune failed'))
prune()
const pruning = setInterval(prune, 15 * 60_000)
pruning.unref()

let stopping = false
async function shutdown(signal: string) {
  if (stopping) return
  stopping = true
  log.info(`${signal}: readiness now answers 503; finishing open requests (at most ${config.shutdownMs / 1000} s), then closing the database`)
  // Readiness turns to 503 and no board stream opens here any more; no new connection is taken.
  drain.begin()
  const closed = new Promise((resolve) => server.once('close', resolve))
  server.close()
  clearInterval(pruning)
  // Open board streams would hold the server open: they end now, and each browser's EventSource
  // reconnects (through the proxy, to another server) and catches up there.
  await live.close()
  // A message being sent is finished; one not yet taken stays for another server or the next start.
  await outbox.stop()
  // A kept-alive connection goes as soon as its request is answered; whatever is still open when the
  // wait is over is cut.
  const idle = setInterval(() => server.closeIdleConnections(), 100)
  const force = setTimeout(() => {
    log.warn('shutdown: requests still open after the wait; closing their connections')
    server.closeAllConnections()
  }, config.shutdownMs)
  await closed
  clearInterval(idle)
  clearTimeout(force)
  await localSmtp?.close()
  await fakePayments?.close()
  await handle.close()
  log.info('shutdown: done')
  process.exit(0)
}
process.on('SIGINT', () => void shutdown('SIGINT'))
process.on('SIGTERM', () => void shutdown('SIGTERM'))
