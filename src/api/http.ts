import type { z } from 'zod'
import type { FieldParams } from '@shared/schemas/field-messages'
import { fieldText } from '@/composables/field-words'
import { reasonText, refusalText } from '@/composables/refusal-words'

/** A refused field: `message` is in the reader's language once received (its `code` under `fields`, else the server's English). */
export interface FieldIssue {
  path: string
  message: string
  code?: string
  params?: FieldParams
}

/** A refused or failed request, with the server's own message and per-field issues. */
export class ApiError extends Error {
  constructor(
    readonly status: number,
    message: string,
    readonly issues: FieldIssue[] = [],
    readonly body: Record<string, unknown> = {},
  ) {
    super(message)
  }
}

let csrfToken = ''
export function setCsrfToken(token: string) {
  csrfToken = token
}

// Told when a staff request is answered 401: the session ended while the page was open (the session
// store asks the person to sign in again over the page, so nothing they typed is lost).
let sessionEnded: () => void = () => {}
export function onSessionEnded(handler: () => void) {
  sessionEnded = handler
}

type Method = 'GET' | 'POST' | 'PATCH' | 'PUT' | 'DELETE'

/** The answer parsed with `schema`; a schema still loading (a dynamic import) arrives while the request is under way. */
export async function request<T extends z.ZodType>(method: Method, url: string, schema: T | Promise<T>, body?: unknown): Promise<z.infer<T>> {
  const [res, parser] = await Promise.all([send(method, url, body), schema])
  return parser.parse(await res.json())
}

/** A request whose answer has no body (204). */
export async function requestEmpty(method: Method, url: string, body?: unknown): Promise<void> {
  await send(method, url, body)
}

async function send(method: Method, url: string, body?: unknown): Promise<Response> {
  const headers: Record<string, string> = { accept: 'application/json' }
  if (method !== 'GET') headers['x-csrf-token'] = csrfToken
  let payload: BodyInit | undefined
  if (body instanceof FormData) payload = body
  else if (body !== undefined) {
    headers['content-type'] = 'application/json'
    payload = JSON.stringify(body)
  }
  let res: Response
  try {
    res = await fetch(url, { method, headers, body: payload, credentials: 'same-origin' })
  } catch {
    throw new ApiError(0, 'The server cannot be reached. Check the connection and try again.')
  }
  // Signing in itself answers 401 to a wrong password: that is not a session ending.
  if (res.status === 401 && !url.startsWith('/api/session')) sessionEnded()
  if (!res.ok) {
    type Reason = { key?: string; params?: Record<string, string | number>; message: string }
    const data = (await res.json().catch(() => ({}))) as { error?: string; code?: string; params?: Record<string, string | number>; issues?: FieldIssue[]; reasons?: Reason[] }
    // A refusal's code (refusals.<code> in shared/messages) gives its words in the reader's language; the English is the fallback.
    // So does each field issue's code (fields.<code>); a refusal that is only its issues reads as they do.
    // An issue that only repeats the refusal's sentence (a payment's amount) reads as the refusal does.
    // A refused move is its lifecycle reasons, each with its own key: the sentence is theirs, joined.
    const reasons = !data.code && data.reasons?.length ? data.reasons.map(reasonText).join(' ') : undefined
    const refusal = reasons ?? refusalText(data.code, data.params, data.error ?? `The server answered ${res.status}.`)
    const issues = (data.issues ?? []).map((i) => ({ ...i, message: !i.code && data.code && i.message === data.error ? refusal : fieldText(i) }))
    const message = !data.code && issues.some((i) => i.code) ? issuesText(issues) : refusal
    throw new ApiError(res.status, message, issues, data as Record<string, unknown>)
  }
  return res
}

/** Several refused fields in a sentence, as the server's English summary says them. */
function issuesText(issues: FieldIssue[]): string {
  return issues.length === 1 ? issues[0]!.message : refusalText('fixFields', { n: issues.length, first: issues[0]!.message }, issues[0]!.message)
}
