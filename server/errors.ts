import type { ErrorRequestHandler, RequestHandler } from 'express'
import { ZodError } from 'zod'
import { DomainError } from '@shared/domain/errors'
import type { Reason } from '@shared/domain/lifecycle'
import type english from '@shared/messages/en/refusals.json'
import { type FieldCode, type FieldParams, withFieldWords } from '@shared/schemas/field-messages'
import { redactUrl } from './logging'

/** A refused field: `message` in English, `code` (a key under `fields` in shared/messages) and `params` for the reader's language. */
export interface Issue {
  path: string
  message: string
  code?: FieldCode
  params?: FieldParams
}

/** A field the server itself refuses (not the schema): its English beside its code, as `said()` is for a refusal. */
export const fieldIssue = (path: string, code: FieldCode, message: string, params?: FieldParams): Issue => ({ path, message, code, ...(params ? { params } : {}) })

/**
 * The field at fault of a coded refusal, its message the refusal's own English: the client words it as the
 * refusal (a computation's DomainError, whose code names its words under `refusals`).
 */
export const refusalIssue = (path: string, message: string): Issue => ({ path, message })

/** An error with a status and a message meant for the person using the app. */
export class AppError extends Error {
  constructor(
    readonly status: number,
    message: string,
    readonly extra: Record<string, unknown> = {},
  ) {
    super(message)
  }
}

/** A refusal's code: its words in every language are `refusals.<code>` in shared/messages (the type keeps it in the English catalog). */
export type RefusalCode = Exclude<keyof (typeof english)['refusals'], 'reasons' | 'cardReasons'>

/**
 * The code and parameters beside a refusal's English sentence (`{ error, code, params }` in the answer),
 * so the client says it in the reader's language: `conflict('…', said('holdLifted', { date }))`.
 */
export const said = (code: RefusalCode, params?: Record<string, string | number>, extra: Record<string, unknown> = {}) => ({ code, ...(params ? { params } : {}), ...extra })

/**
 * A lifecycle verdict's reasons as one refusal's parameters (`said('notYetReasons', reasonParams(reasons))`):
 * `reasons` lists their keys (words `refusals.reasons.<key>`), each reason's own parameters prefixed by its place.
 */
export const reasonParams = (reasons: readonly Reason[]) => ({
  reasons: reasons.map((r) => r.key ?? r.code).join(','),
  ...Object.fromEntries(reasons.flatMap((r, i) => Object.entries(r.params ?? {}).map(([k, v]) => [`${i}.${k}`, v]))),
})

export const badRequest = (message: string, issues?: Issue[]) => new AppError(400, message, issues ? { issues } : {})
export const unauthorized = () => new AppError(401, 'You are signed out: your session has ended. Sign in again to go on.', said('signedOut'))
export const forbidden = (message = 'Your role may not do this.', code: RefusalCode = 'forbidden') => new AppError(403, message, said(code))
export const notFound = (what = 'That') => new AppError(404, `${what} was not found.`, said('notFound'))
export const conflict = (message: string, extra: Record<string, unknown> = {}) => new AppError(409, message, extra)
export const unprocessable = (message: string, extra: Record<string, unknown> = {}) =>
  new AppError(422, message, extra)

/** Each issue's path and English message, with the code and parameters of a message a schema wrote (zod's own have none). */
export function zodIssues(err: ZodError): Issue[] {
  return err.issues.map((i) => withFieldWords({ path: i.path.join('.') || '(body)', message: i.message }))
}

/** The refusal in words for a person: each issue's own message, not the field paths a program reads in `issues`. */
export function summaryOf(issues: Issue[]): string {
  if (issues.length === 1) return issues[0]!.message
  return `${issues.length} things to fix. First: ${issues[0]!.message}`
}

export const notFoundHandler: RequestHandler = (req, res) => {
  res.status(404).json({ error: `No such route: ${req.method} ${req.path}`, ...said('noSuchRoute', { method: req.method, path: req.path }) })
}

// PostgreSQL: 22021 character_not_in_repertoire (a NUL in text), 22P05 untranslatable_character (\u0000 in jsonb).
const UNSTORABLE_TEXT = new Set(['22021', '22P05'])

interface Logger {
  error(obj: unknown, msg?: string): void
}

export function errorHandler(log: Logger): ErrorRequestHandler {
  return (err, req, res, _next) => {
    if (res.headersSent) return
    if (err instanceof ZodError) {
      const issues = zodIssues(err)
      res.status(400).json({ error: summaryOf(issues), issues })
      return
    }
    // A computation refused its input: the person gets the core's own words, pointed at the field; its code
    // (a DomainErrorCode, the type keeps each in the English catalog) names its words under `refusals`.
    if (err instanceof DomainError) {
      const code: RefusalCode = err.code
      res.status(400).json({ error: err.message, ...said(code), issues: [refusalIssue(err.field ?? '(body)', err.message)] })
      return
    }
    if (err instanceof AppError) {
      res.status(err.status).json({ error: err.message, ...err.extra })
      return
    }
    // The database's own refusal of text it cannot store (a NUL character that came another way).
    if (UNSTORABLE_TEXT.has(err?.cause?.code ?? err?.code)) {
      res.status(400).json({ error: 'Some text contains a character that cannot be stored (NUL). Remove it and try again.', ...said('unstorableText') })
      return
    }
    // A body that is not a JSON object or array (a bare number, `null`, broken JSON): the body is the field.
    if (err?.type === 'entity.parse.failed') {
      const message = 'The request body must be a JSON object.'
      res.status(400).json({ error: message, issues: [fieldIssue('(body)', 'common.bodyNotJson', message)] })
      return
    }
    // body-parser and multer errors carry a status and a safe message.
    const status = typeof err?.status === 'number' ? err.status : typeof err?.statusCode === 'number' ? err.statusCode : 500
    if (status >= 400 && status < 500) {
      res.status(status).json({ error: err.expose === false ? 'The request was refused.' : String(err.message) })
      return
    }
    log.error({ err, method: req.method, url: redactUrl(req.originalUrl) }, 'request failed')
    res.status(500).json({ error: 'Something went wrong on the server. The error was logged.', ...said('serverError') })
  }
}
