import path from 'node:path'
import { z } from 'zod'
import type { S3Settings } from './files/index'
import { LOCAL_MAP, type MapConfig } from './map/index'

const flag = z
  .enum(['0', '1', 'true', 'false', 'yes', 'no'])
  .transform((v) => v === '1' || v === 'true' || v === 'yes')

const envSchema = z.object({
  PORT: z.coerce.number().int().min(1).max(65_535).default(3000),
  HOST: z.string().min(1).default('0.0.0.0'),
  DATABASE_URL: z.url({ protocol: /^postgres(ql)?$/ }).optional(),
  HOLDFAST_DATA_DIR: z.string().min(1).default('./data'),
  // A migrated empty embedded database (npm run build makes it): a new data directory starts from it.
  HOLDFAST_DB_TEMPLATE: z.string().min(1).default('dist/db-template.tar.gz'),
  // The same with the demo yard played into it (npm run build), and beside it <file>.json: used when the demo is on.
  HOLDFAST_DEMO_TEMPLATE: z.string().min(1).default('dist/db-demo-template.tar.gz'),
  // The committed migrations, applied at every start; a bundle run from elsewhere points here.
  HOLDFAST_MIGRATIONS: z.string().min(1).default('db/migrations'),
  // The shipped sample rule sets (JSON), loaded with the demo or a company's first yard.
  HOLDFAST_RULE_SETS: z.string().min(1).default('server/rule-sets/samples'),
  // The secret that seals the history (never in the database); made on first start when absent.
  HOLDFAST_HISTORY_KEY_FILE: z.string().min(1).optional(),
  // The built client the server serves.
  HOLDFAST_CLIENT_DIR: z.string().min(1).default('dist/client'),
  HOLDFAST_DEMO: flag.default(true),
  // Behind a TLS-terminating proxy: Secure cookies, HSTS and upgrade-insecure-requests.
  HOLDFAST_HTTPS: flag.default(false),
  HOLDFAST_TRUST_PROXY: z.string().optional(),
  HOLDFAST_ORIGINS: z.string().optional(),
  SESSION_SECRET: z.string().min(32, 'SESSION_SECRET must be at least 32 characters').optional(),
  HOLDFAST_SIGNIN_PER_IP: z.coerce.number().int().min(1).default(50),
  HOLDFAST_SIGNIN_PER_ACCOUNT: z.coerce.number().int().min(1).default(5),
  // How long an owner link opens the owner's page, in days.
  HOLDFAST_OWNER_LINK_DAYS: z.coerce.number().int().min(1).max(365).default(30),
  // Wrong owner codes, or vehicle lookups, from one address before each further try waits.
  HOLDFAST_PUBLIC_TRIES: z.coerce.number().int().min(1).default(10),
  LOG_LEVEL: z.enum(['fatal', 'error', 'warn', 'info', 'debug', 'trace', 'silent']).default('info'),
  // Uploaded photos and papers; outside any served folder. Defaults to <data dir>/files.
  HOLDFAST_FILES_DIR: z.string().min(1).optional(),
  // Files in an S3-compatible bucket instead of HOLDFAST_FILES_DIR (every server of one database must
  // share one place). Credentials come from the AWS SDK's usual chain: AWS_ACCESS_KEY_ID and
  // AWS_SECRET_ACCESS_KEY, AWS_PROFILE, or the machine's role.
  HOLDFAST_S3_BUCKET: z.string().regex(/^[a-z0-9][a-z0-9.-]{1,61}[a-z0-9]$/, 'HOLDFAST_S3_BUCKET must be a bucket name (3–63 lower-case letters, digits, dots, hyphens)').optional(),
  HOLDFAST_S3_ENDPOINT: z.url({ protocol: /^https?$/, error: 'HOLDFAST_S3_ENDPOINT must be an http(s) URL' }).optional(),
  HOLDFAST_S3_REGION: z.string().min(1).optional(),
  HOLDFAST_S3_PREFIX: z.string().regex(/^([a-z0-9-]+\/)*$/, 'HOLDFAST_S3_PREFIX must be folder names ending in / (e.g. holdfast/)').default(''),
  // Bucket in the path rather than the host name: the default with HOLDFAST_S3_ENDPOINT (MinIO and most others).
  HOLDFAST_S3_PATH_STYLE: flag.optional(),
  // On SIGTERM/SIGINT, how long open requests may take to finish before their connections are cut.
  HOLDFAST_SHUTDOWN_SECONDS: z.coerce.number().int().min(0).max(300).default(10),
  // A z/x/y tile template and a Nominatim-style geocoder; by default the built-in local stand-ins.
  HOLDFAST_TILE_URL: z.string().regex(/^(https?:\/\/|\/).*\{z\}.*\{x\}.*\{y\}/, 'HOLDFAST_TILE_URL must be a tile template with {z}, {x} and {y}').optional(),
  HOLDFAST_TILE_ATTRIBUTION: z.string().max(300).optional(),
  HOLDFAST_MAP_MAX_ZOOM: z.coerce.number().int().min(1).max(22).default(19),
  HOLDFAST_GEOCODER_URL: z.string().regex(/^(https?:\/\/|\/)/, 'HOLDFAST_GEOCODER_URL must be an http(s) URL or a path on this server').optional(),
  // Outgoing mail: any SMTP relay (smtp:// or smtps://, user and password in the URL). Left unset, the
  // app starts its own stand-in on loopback that keeps every message (server/fakes/local-smtp.ts).
  SMTP_URL: z.url({ protocol: /^smtps?$/, error: 'SMTP_URL must be an smtp:// or smtps:// URL' }).optional(),
  // Where staff and owners reach Holdfast (https://yard.example.com): links and QR codes on documents and e-mail.
  HOLDFAST_PUBLIC_URL: z.url({ protocol: /^https?$/, error: 'HOLDFAST_PUBLIC_URL must be an http(s) URL' }).optional(),
  HOLDFAST_MAIL_FROM: z.string().min(3).max(300).default('Holdfast <holdfast@localhost>'),
  // Card payments: the payment service's secret key and its webhook signing secret. Left unset, the app
  // starts its own stand-in of the service on loopback (server/fakes/payment-service.ts).
  STRIPE_SECRET_KEY: z.string().regex(/^(sk|rk)_(test|live)_\w+$/, 'STRIPE_SECRET_KEY must be a secret key (sk_test_…, sk_live_…)').optional(),
  STRIPE_WEBHOOK_SECRET: z.string().regex(/^whsec_\w+$/, 'STRIPE_WEBHOOK_SECRET must be the webhook signing secret (whsec_…)').optional(),
  // The stand-in's port (0: any free one, named in the start-up log).
  HOLDFAST_PAYMENTS_FAKE_PORT: z.coerce.number().int().min(0).max(65_535).default(0),
})

export interface Config {
  port: number
  host: string
  database: { kind: 'postgres'; url: string } | { kind: 'pglite'; dataDir: string; template: string }
  migrationsFolder: string
  ruleSetsFolder: string
  dataDir: string
  demo: boolean
  /** The database template with the demo yard in it; `${demoTemplate}.json` says when it was built and holds its files. */
  demoTemplate: string
  https: boolean
  trustProxy: string | undefined
  /** Origins allowed to make state-changing requests besides the server's own host. */
  origins: string[]
  sessionSecret: string | undefined
  logLevel: string
  signInLimits: { perIp: number; perAccount: number; windowMs: number }
  ownerLinkDays: number
  publicLimits: { perAddress: number; windowMs: number }
  clientDir: string
  filesDir: string
  /** Files in a bucket instead of filesDir, when HOLDFAST_S3_BUCKET is set. */
  s3: S3Settings | undefined
  /** How long a graceful shutdown waits for open requests. */
  shutdownMs: number
  /** The history key's file: beside the data directory unless set (every server of one database needs the same file). */
  historyKeyFile: string
  map: MapConfig
  /** Where people reach Holdfast, for links and QR codes; the request's own address when unset. */
  publicUrl: string | undefined
  /** The SMTP relay, or where the local stand-in keeps what it receives. */
  mail: { smtpUrl: string | undefined; localFolder: string; from: string }
  /** Card payments: the real service by its key, or the local stand-in. */
  payments: { kind: 'service'; secretKey: string; webhookSecret: string } | { kind: 'fake'; port: number }
}

export function loadConfig(env: NodeJS.ProcessEnv = process.env): Config {
  const parsed = envSchema.safeParse(env)
  if (!parsed.success) {
    const lines = parsed.error.issues.map((i) => `  ${i.path.join('.')}: ${i.message}`)
    throw new Error(`Holdfast cannot start: the environment is not valid.\n${lines.join('\n')}`)
  }
  const e = parsed.data
  // Holdfast serves plain HTTP; it only knows a request came over HTTPS from a trusted proxy's
  // X-Forwarded-Proto, and without that no Secure session cookie is ever set: no one could sign in.
  if (e.HOLDFAST_HTTPS && !e.HOLDFAST_TRUST_PROXY) {
    throw new Error(
      'Holdfast cannot start: HOLDFAST_HTTPS=1 needs HOLDFAST_TRUST_PROXY, the address of the proxy that ends TLS ' +
        '(e.g. HOLDFAST_TRUST_PROXY=loopback when it runs on this machine, or its IP address), so that its ' +
        'X-Forwarded-Proto header is believed. Or unset HOLDFAST_HTTPS for plain HTTP.',
    )
  }
  const s3Only = (['HOLDFAST_S3_ENDPOINT', 'HOLDFAST_S3_REGION', 'HOLDFAST_S3_PATH_STYLE'] as const).filter((k) => e[k] !== undefined)
  if (!e.HOLDFAST_S3_BUCKET && (s3Only.length > 0 || e.HOLDFAST_S3_PREFIX)) {
    throw new Error(`Holdfast cannot start: ${[...s3Only, ...(e.HOLDFAST_S3_PREFIX ? ['HOLDFAST_S3_PREFIX'] : [])].join(', ')} set without HOLDFAST_S3_BUCKET; name the bucket, or unset them to keep files on disk.`)
  }
  if (e.HOLDFAST_S3_BUCKET && e.HOLDFAST_FILES_DIR) {
    throw new Error('Holdfast cannot start: both HOLDFAST_S3_BUCKET and HOLDFAST_FILES_DIR are set; files live in one place. Unset one.')
  }
  if (e.STRIPE_SECRET_KEY && !e.STRIPE_WEBHOOK_SECRET) {
    throw new Error('Holdfast cannot start: STRIPE_SECRET_KEY needs STRIPE_WEBHOOK_SECRET, the signing secret of the webhook endpoint /api/card-payments/webhook, or no card payment is ever recorded.')
  }
  const dataDir = path.resolve(e.HOLDFAST_DATA_DIR)
  return {
    port: e.PORT,
    host: e.HOST,
    database: e.DATABASE_URL ? { kind: 'postgres', url: e.DATABASE_URL } : { kind: 'pglite', dataDir, template: path.resolve(e.HOLDFAST_DB_TEMPLATE) },
    migrationsFolder: path.resolve(e.HOLDFAST_MIGRATIONS),
    ruleSetsFolder: path.resolve(e.HOLDFAST_RULE_SETS),
    dataDir,
    demo: e.HOLDFAST_DEMO,
    demoTemplate: path.resolve(e.HOLDFAST_DEMO_TEMPLATE),
    https: e.HOLDFAST_HTTPS,
    trustProxy: e.HOLDFAST_TRUST_PROXY,
    origins: (e.HOLDFAST_ORIGINS ?? '').split(',').map((s) => s.trim()).filter(Boolean),
    sessionSecret: e.SESSION_SECRET,
    logLevel: e.LOG_LEVEL,
    signInLimits: { perIp: e.HOLDFAST_SIGNIN_PER_IP, perAccount: e.HOLDFAST_SIGNIN_PER_ACCOUNT, windowMs: 15 * 60_000 },
    ownerLinkDays: e.HOLDFAST_OWNER_LINK_DAYS,
    publicLimits: { perAddress: e.HOLDFAST_PUBLIC_TRIES, windowMs: 15 * 60_000 },
    clientDir: path.resolve(e.HOLDFAST_CLIENT_DIR),
    filesDir: path.resolve(e.HOLDFAST_FILES_DIR ?? path.join(dataDir, 'files')),
    s3: e.HOLDFAST_S3_BUCKET
      ? {
          bucket: e.HOLDFAST_S3_BUCKET,
          endpoint: e.HOLDFAST_S3_ENDPOINT,
          region: e.HOLDFAST_S3_REGION ?? env.AWS_REGION ?? 'us-east-1',
          prefix: e.HOLDFAST_S3_PREFIX,
          forcePathStyle: e.HOLDFAST_S3_PATH_STYLE ?? e.HOLDFAST_S3_ENDPOINT !== undefined,
        }
      : undefined,
    shutdownMs: e.HOLDFAST_SHUTDOWN_SECONDS * 1000,
    historyKeyFile: path.resolve(e.HOLDFAST_HISTORY_KEY_FILE ?? `${dataDir}.history-key`),
    publicUrl: e.HOLDFAST_PUBLIC_URL?.replace(/\/+$/, ''),
    mail: { smtpUrl: e.SMTP_URL, localFolder: path.join(dataDir, 'mail'), from: e.HOLDFAST_MAIL_FROM },
    payments: e.STRIPE_SECRET_KEY
      ? { kind: 'service', secretKey: e.STRIPE_SECRET_KEY, webhookSecret: e.STRIPE_WEBHOOK_SECRET! }
      : { kind: 'fake', port: e.HOLDFAST_PAYMENTS_FAKE_PORT },
    map: {
      tileUrl: e.HOLDFAST_TILE_URL ?? LOCAL_MAP.tileUrl,
      tileAttribution: e.HOLDFAST_TILE_ATTRIBUTION ?? (e.HOLDFAST_TILE_URL ? '' : LOCAL_MAP.tileAttribution),
      maxZoom: e.HOLDFAST_MAP_MAX_ZOOM,
      geocoderUrl: (e.HOLDFAST_GEOCODER_URL ?? LOCAL_MAP.geocoderUrl).replace(/\/+$/, ''),
    },
  }
}
