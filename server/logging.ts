import { DrizzleQueryError } from 'drizzle-orm'
import { pino, type Logger } from 'pino'

// OWASP ASVS 5.0 V16: logs never carry what grants access (cookies, CSRF tokens, bearer tokens, tokens
// in links) nor the personal data a failed query was carrying. These serializers shape every request
// line and every logged error, whichever logger the app was given.

export const REDACTED = '[Redacted]'

/** Paths whose next segment is a bearer token: owner links, gate passes, calendar feeds. A new one goes here. */
const TOKEN_PATH = /^(\/api\/owner\/|\/o\/|\/api\/gate\/|\/g\/|\/api\/calendar\/)[^/?#]+/i
/** Query parameters that may carry a token, a one-time code or a password. */
const SECRET_PARAM = /token|code|secret|password|signature|key/i
/** A long random-looking segment (but not a record's UUID): a token on a path nobody listed yet. */
const TOKEN_LIKE = /^[A-Za-z0-9_-]{32,}$/
const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i

/** Headers that grant access: logged only as present. */
const SECRET_HEADERS = new Set(['cookie', 'set-cookie', 'authorization', 'proxy-authorization', 'x-csrf-token', 'stripe-signature'])
/** The others worth reading in a request line; the rest (CSP and other fixed response headers) is noise. */
const KEPT_HEADERS = new Set([
  'host', 'user-agent', 'accept', 'accept-language', 'content-type', 'content-length', 'origin', 'referer',
  'x-forwarded-for', 'x-forwarded-proto', 'if-match', 'if-none-match', 'etag', 'location', 'cache-control',
])
const URL_HEADERS = new Set(['referer', 'location'])

/** A path and query with every token and secret parameter replaced by [Redacted]. */
export function redactUrl(url: string): string {
  const q = url.indexOf('?')
  const path = (q < 0 ? url : url.slice(0, q))
    .replace(TOKEN_PATH, (_all, prefix: string) => prefix + REDACTED)
    .split('/')
    .map((segment) => (TOKEN_LIKE.test(segment) && !UUID.test(segment) ? REDACTED : segment))
    .join('/')
  if (q < 0) return path
  const query = url
    .slice(q + 1)
    .split('&')
    .map((pair) => {
      const eq = pair.indexOf('=')
      const name = eq < 0 ? pair : pair.slice(0, eq)
      return SECRET_PARAM.test(safeDecode(name)) ? `${name}=${REDACTED}` : pair
    })
    .join('&')
  return `${path}?${query}`
}

function safeDecode(s: string): string {
  try {
    return decodeURIComponent(s)
  } catch {
    return s
  }
}

/** An absolute URL (Referer, Location) with its path and query redacted; anything unparsable goes entirely. */
function redactAbsoluteUrl(value: string): string {
  if (value.startsWith('/')) return redactUrl(value)
  try {
    const u = new URL(value)
    return u.origin + redactUrl(u.pathname + u.search)
  } catch {
    return REDACTED
  }
}

type Headers = Record<string, string | string[] | number | undefined>

function headersForLog(headers: Headers | undefined): Record<string, unknown> {
  const out: Record<string, unknown> = {}
  for (const [name, value] of Object.entries(headers ?? {})) {
    const key = name.toLowerCase()
    if (value === undefined) continue
    if (SECRET_HEADERS.has(key)) out[key] = REDACTED
    else if (URL_HEADERS.has(key)) out[key] = redactAbsoluteUrl(String(value))
    else if (KEPT_HEADERS.has(key)) out[key] = value
  }
  return out
}

// pino-http hands these the standard serializers' output (with `raw`); a direct log call hands them
// the raw object. Both go through the standard serializer first.
type Raw = { raw?: unknown }
const standard = pino.stdSerializers

function requestForLog(input: Raw) {
  const req = standard.req((input.raw ?? input) as Parameters<typeof standard.req>[0])
  return { id: req.id, method: req.method, url: redactUrl(String(req.url ?? '')), headers: headersForLog(req.headers), remoteAddress: req.remoteAddress }
}

function responseForLog(input: Raw) {
  const res = standard.res((input.raw ?? input) as Parameters<typeof standard.res>[0])
  return { statusCode: res.statusCode, headers: headersForLog(res.headers as Headers) }
}

/**
 * An error as pino logs it, minus the values a failed query carried: drizzle puts its parameters (owner
 * names, VINs, plates) into the message, the stack and `params`; PostgreSQL's `detail` quotes the row.
 * The statement itself and the database's own message stay: they are what a developer needs.
 */
function errorForLog(input: unknown): unknown {
  const raw = (input as Raw | undefined)?.raw ?? input
  const out = standard.err(raw as Error) as unknown as Record<string, unknown>
  if (typeof out !== 'object' || out === null) return out
  for (let e: unknown = raw, depth = 0; e instanceof Error && depth < 10; e = e.cause, depth++) {
    if (!(e instanceof DrizzleQueryError)) continue
    const leaked = `\nparams: ${e.params}`
    for (const key of ['message', 'stack'] as const) {
      if (typeof out[key] === 'string') out[key] = (out[key] as string).split(leaked).join('')
    }
  }
  delete out.params
  delete out.detail
  return out
}

export const logSerializers = { req: requestForLog, res: responseForLog, err: errorForLog }

/** The app's logger: the given one with these serializers, so an injected logger is as safe as the server's. */
export function safeLogger(log: Logger): Logger {
  return log.child({}, { serializers: logSerializers })
}
