import { randomBytes } from 'node:crypto'
import type { RequestHandler } from 'express'
import session from 'express-session'
import type { Database } from '@db/client'
import { DatabaseSessionStore } from '../session/index'

export const IDLE_TIMEOUT_MS = 30 * 60_000
export const ABSOLUTE_TIMEOUT_MS = 12 * 60 * 60_000

export function sessionMiddleware(db: Database, secret: string, secure: boolean): RequestHandler {
  return session({
    name: 'holdfast.sid',
    secret,
    store: new DatabaseSessionStore(db),
    resave: false,
    saveUninitialized: false,
    // Every request pushes the idle expiry 30 minutes on.
    rolling: true,
    cookie: { httpOnly: true, sameSite: 'lax', secure, maxAge: IDLE_TIMEOUT_MS, path: '/' },
  })
}

export function newCsrfToken(): string {
  return randomBytes(32).toString('base64url')
}
