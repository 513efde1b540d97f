import type { AddressInfo } from 'node:net'
import type { Express } from 'express'

/** The app on a real port, for clients that need a streaming connection (EventSource-like). */
export async function listening(app: Express) {
  const server = app.listen(0, '127.0.0.1')
  await new Promise<void>((resolve) => server.once('listening', resolve))
  const url = `http://127.0.0.1:${(server.address() as AddressInfo).port}`
  return {
    url,
    close: () => {
      server.closeAllConnections()
      return new Promise<void>((resolve) => server.close(() => resolve()))
    },
  }
}

/** `name=value` of one cookie a response sets (a sign-in sets more than the session's). */
export function cookieSet(res: Response, name: string): string {
  return (res.headers.getSetCookie().find((c) => c.startsWith(`${name}=`)) ?? '').split(';')[0]!
}

/** A signed-in browser-like session over fetch: its cookie and CSRF token. */
export async function fetchSession(base: string, user: { email: string; password: string }) {
  const first = await fetch(`${base}/api/session`)
  let cookie = cookieSet(first, 'holdfast.csrf')
  const { csrfToken } = (await first.json()) as { csrfToken: string }
  const signIn = await fetch(`${base}/api/session`, {
    method: 'POST',
    headers: { cookie, 'content-type': 'application/json', 'x-csrf-token': csrfToken },
    body: JSON.stringify({ email: user.email, password: user.password }),
  })
  if (signIn.status !== 200) throw new Error(`sign-in failed in test setup: ${signIn.status}`)
  cookie = cookieSet(signIn, 'holdfast.sid')
  const { csrfToken: csrf } = (await signIn.json()) as { csrfToken: string }
  return {
    cookie,
    csrf,
    /** Signs out, on this server or (same cookie, same database) on another one. */
    signOut: (on = base) => fetch(`${on}/api/session`, { method: 'DELETE', headers: { cookie, 'x-csrf-token': csrf } }),
    post: (url: string, body: unknown) =>
      fetch(`${base}${url}`, { method: 'POST', headers: { cookie, 'content-type': 'application/json', 'x-csrf-token': csrf }, body: JSON.stringify(body) }),
    /** A multipart form (files and fields), as a browser's upload sends it. */
    postForm: (url: string, form: FormData) => fetch(`${base}${url}`, { method: 'POST', headers: { cookie, 'x-csrf-token': csrf }, body: form }),
    patch: (url: string, body: unknown) =>
      fetch(`${base}${url}`, { method: 'PATCH', headers: { cookie, 'content-type': 'application/json', 'x-csrf-token': csrf }, body: JSON.stringify(body) }),
    get: (url: string) => fetch(`${base}${url}`, { headers: { cookie } }),
  }
}

export interface StreamMessage {
  id?: string
  data?: string
  retry?: number
}

/** Reads a text/event-stream response message by message, as EventSource would parse it. */
export async function openStream(base: string, cookie: string, opts: { lastEventId?: string; since?: string } = {}) {
  const controller = new AbortController()
  const headers: Record<string, string> = { cookie, accept: 'text/event-stream' }
  if (opts.lastEventId) headers['last-event-id'] = opts.lastEventId
  const query = opts.since ? `?since=${encodeURIComponent(opts.since)}` : ''
  const res = await fetch(`${base}/api/board/events${query}`, { headers, signal: controller.signal })
  const reader = res.body!.pipeThrough(new TextDecoderStream()).getReader()
  let buffer = ''

  async function read(): Promise<StreamMessage | null> {
    for (;;) {
      const end = buffer.indexOf('\n\n')
      if (end >= 0) {
        const block = buffer.slice(0, end)
        buffer = buffer.slice(end + 2)
        const msg: StreamMessage = {}
        for (const line of block.split('\n')) {
          if (line.startsWith('id: ')) msg.id = line.slice(4)
          else if (line.startsWith('data: ')) msg.data = line.slice(6)
          else if (line.startsWith('retry: ')) msg.retry = Number(line.slice(7))
        }
        if (msg.id !== undefined || msg.data !== undefined || msg.retry !== undefined) return msg
        continue
      }
      const chunk = await reader.read()
      if (chunk.done) return null
      buffer += chunk.value
    }
  }

  return {
    status: res.status,
    contentType: res.headers.get('content-type'),
    /** The next message with data whose parsed body passes `test`. */
    async next(test: (body: Record<string, unknown>) => boolean = () => true): Promise<{ id?: string; body: Record<string, unknown> }> {
      for (;;) {
        const msg = await read()
        if (!msg) throw new Error('the event stream ended')
        if (msg.data === undefined) continue
        const body = JSON.parse(msg.data) as Record<string, unknown>
        if (test(body)) return { id: msg.id, body }
      }
    },
    async first(): Promise<StreamMessage | null> {
      return read()
    },
    close: () => controller.abort(),
  }
}
