import { createHash } from 'node:crypto'
import { isIPv6 } from 'node:net'
import { and, eq, inArray, isNull, lt, or, sql } from 'drizzle-orm'
import type { Logger } from 'pino'
import type { Database } from '@db/client'
import { signInFailures } from '@db/schema'

export interface SignInLimits {
  /** Failed sign-ins for one account from one address (or from one known device) before each further attempt waits. */
  perAccount: number
  /** Failed sign-ins from one address, whatever the account, before new devices there wait. */
  perIp: number
  /** Failures older than this are forgotten; no wait is longer. */
  windowMs: number
  /** The clock, for tests. */
  now?: () => number
}

/** What one sign-in attempt counts against, and how many failures each allows before a wait. */
export interface Counters {
  keys: { key: string; free: number }[]
  email: string
  ip: string
  knownDevice: boolean
}

// The first wait, doubled by each further failure, up to the window.
const FIRST_WAIT_MS = 5_000
// Failures on one account from every address, before new devices wait: many addresses guessing at it.
const ACCOUNT_FACTOR = 10

const hashed = (kind: string, ...parts: string[]) => `${kind}:${createHash('sha256').update(parts.join('\n')).digest('base64url').slice(0, 32)}`

/**
 * Slows password guessing without handing anyone a lockout (OWASP ASVS 5.0 V6.1.1, V6.3.1):
 * failures are counted per account at an address, per address and per account, and past a few
 * of them attempts from that address wait a doubling delay. A browser that has signed in to the
 * account before (a known device, server/session/known-devices.ts) is counted on its own, so a
 * stranger's guesses never keep the account's own people out. Successes are not counted; the
 * counters are rows in the database, shared by every app server.
 */
export function signInThrottle(db: Database, limits: SignInLimits, log: Pick<Logger, 'warn'>) {
  const now = () => limits.now?.() ?? Date.now()

  return {
    countersFor(email: string, ip: string, device: string | null): Counters {
      const keys = device
        ? [{ key: hashed('device', device), free: limits.perAccount }]
        : [
            { key: hashed('account-address', email, ip), free: limits.perAccount },
            { key: hashed('address', ip), free: limits.perIp },
            { key: hashed('account', email), free: limits.perAccount * ACCOUNT_FACTOR },
          ]
      return { keys, email, ip, knownDevice: device !== null }
    },

    /** How long this attempt must wait before its password is even checked (0: go ahead). */
    async waitMs(counters: Counters): Promise<number> {
      const rows = await db
        .select({ blockedUntil: signInFailures.blockedUntil })
        .from(signInFailures)
        .where(inArray(signInFailures.key, counters.keys.map((k) => k.key)))
      const until = Math.max(0, ...rows.map((r) => r.blockedUntil?.getTime() ?? 0))
      return Math.max(0, until - now())
    },

    async failed(counters: Counters): Promise<void> {
      const at = new Date(now())
      let worst = 0
      for (const { key, free } of counters.keys) {
        const failures = await countFailure(db, key, at, { windowMs: limits.windowMs, free })
        if (failures < free) continue
        worst = Math.max(worst, failures)
      }
      // Who and from where, never what was typed.
      if (worst > 0) log.warn({ email: counters.email, ip: counters.ip, failures: worst, knownDevice: counters.knownDevice }, 'repeated failed sign-ins')
    },

    /** The right password: its account-at-address (or device) count starts again. Nothing else is counted. */
    async succeeded(counters: Counters): Promise<void> {
      await db.delete(signInFailures).where(eq(signInFailures.key, counters.keys[0]!.key))
    },
  }
}

export type SignInThrottle = ReturnType<typeof signInThrottle>

/**
 * One more failure on a counter (an account and address, an address on a public page): the count
 * restarts after a quiet window; past `free` failures the counter is blocked for a wait that doubles
 * with each further failure, never longer than the window. Returns the count.
 */
export async function countFailure(db: Database, key: string, at: Date, limits: { windowMs: number; free: number }): Promise<number> {
  const windowStart = new Date(at.getTime() - limits.windowMs).toISOString()
  const [row] = await db
    .insert(signInFailures)
    .values({ key, failures: 1, lastFailureAt: at })
    .onConflictDoUpdate({
      target: signInFailures.key,
      set: {
        failures: sql`case when ${signInFailures.lastFailureAt} < ${windowStart}::timestamptz then 1 else ${signInFailures.failures} + 1 end`,
        lastFailureAt: at,
      },
    })
    .returning({ failures: signInFailures.failures })
  const over = row!.failures - limits.free
  if (over >= 0) {
    const wait = Math.min(FIRST_WAIT_MS * 2 ** over, limits.windowMs)
    await db.update(signInFailures).set({ blockedUntil: new Date(at.getTime() + wait) }).where(eq(signInFailures.key, key))
  }
  return row!.failures
}

/**
 * The address a throttle counts: an IPv4 address as it is, an IPv6 one by its /64 network, which
 * one subscriber usually holds whole (counting single IPv6 addresses would give them billions).
 */
export function addressKey(ip: string): string {
  const v4 = /^::ffff:(\d+\.\d+\.\d+\.\d+)$/i.exec(ip)
  if (v4) return v4[1]!
  if (!isIPv6(ip)) return ip
  const [head = '', tail = ''] = ip.split('::')
  const left = head ? head.split(':') : []
  const right = tail ? tail.split(':') : []
  const groups = ip.includes('::') ? [...left, ...Array(8 - left.length - right.length).fill('0'), ...right] : left
  return `${groups.slice(0, 4).map((g) => parseInt(g, 16).toString(16)).join(':')}::/64`
}

/** Counters whose failures are older than the window and whose wait is over. */
export async function pruneSignInFailures(db: Database, windowMs: number, now = new Date()): Promise<void> {
  await db
    .delete(signInFailures)
    .where(
      and(
        lt(signInFailures.lastFailureAt, new Date(now.getTime() - windowMs)),
        or(isNull(signInFailures.blockedUntil), lt(signInFailures.blockedUntil, now)),
      ),
    )
}
