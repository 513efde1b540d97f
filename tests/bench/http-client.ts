// The one HTTP client of the benches and the soak runs: a signed-in person talking to Holdfast's API as
// the screens do (the session cookie, the CSRF token on every request, JSON in and out), each request
// counted and timed.

export interface Answer {
  status: number
  /** The JSON answer, or {} when the answer is not JSON (a PDF, an empty body). */
  body: Record<string, unknown>
  /** "POST /api/vehicles/:id/payments": what was asked, ids left out, for grouping and refusals. */
  what: string
  ms: number
}

export interface Credentials {
  email: string
  password: string
}

export class HttpClient {
  private readonly cookies = new Map<string, string>()
  csrf = ''
  userId = ''
  /** Requests made so far, answered or not. */
  requests = 0
  constructor(readonly base: string) {}

  /** The Cookie header this person sends (for a request made outside the client, such as an event stream). */
  get cookie() {
    return [...this.cookies].map(([k, v]) => `${k}=${v}`).join('; ')
  }

  /** A JSON request (or none, for a GET); the answer's body parsed when it is JSON. */
  call(method: string, url: string, body?: unknown): Promise<Answer> {
    return this.send(method, url, body === undefined ? undefined : JSON.stringify(body), { 'content-type': 'application/json' })
  }

  /** A multipart upload (photos, a tow-in with its pictures), as the browser sends a form. */
  upload(url: string, form: FormData): Promise<Answer> {
    return this.send('POST', url, form, {})
  }

  /** A GET whose answer is a file (a PDF): its bytes, with the status and time. */
  async download(url: string): Promise<Answer & { bytes: Buffer }> {
    let bytes = Buffer.alloc(0)
    const answer = await this.send('GET', url, undefined, {}, async (res) => {
      bytes = Buffer.from(await res.arrayBuffer())
      return {}
    })
    return { ...answer, bytes }
  }

  async signIn(who: Credentials) {
    this.csrf = String((await this.call('GET', '/api/session')).body.csrfToken)
    const res = await this.call('POST', '/api/session', who)
    if (res.status !== 200) throw new Error(`sign-in as ${who.email}: ${res.status} ${JSON.stringify(res.body)}`)
    this.csrf = String(res.body.csrfToken)
    this.userId = String((res.body.user as { id: string }).id)
    return this
  }

  private async send(method: string, url: string, body: BodyInit | undefined, headers: Record<string, string>, read?: (res: Response) => Promise<Record<string, unknown>>): Promise<Answer> {
    this.requests++
    const started = performance.now()
    const res = await fetch(this.base + url, { method, headers: { ...headers, cookie: this.cookie, 'x-csrf-token': this.csrf }, body })
    for (const c of res.headers.getSetCookie()) {
      const [pair] = c.split(';')
      const at = pair!.indexOf('=')
      this.cookies.set(pair!.slice(0, at), pair!.slice(at + 1))
    }
    const parsed = read ? await read(res) : await readJson(res)
    return { status: res.status, body: parsed, what: `${method} ${url.split('?')[0]!.replace(/[0-9a-f]{8}-[0-9a-f-]{27}/g, ':id')}`, ms: performance.now() - started }
  }
}

async function readJson(res: Response): Promise<Record<string, unknown>> {
  const text = await res.text()
  return (res.headers.get('content-type') ?? '').includes('json') && text ? (JSON.parse(text) as Record<string, unknown>) : {}
}

/** The value at quantile `p` (0–1) of values sorted ascending (the nearest rank below); NaN when there are none. */
export const percentile = (sorted: readonly number[], p: number) => sorted[Math.min(sorted.length - 1, Math.floor(sorted.length * p))] ?? NaN

/** Count, median, 95th percentile and maximum of some times, rounded to the millisecond. */
export function summary(times: readonly number[]) {
  const s = [...times].sort((a, b) => a - b)
  return { count: s.length, p50Ms: Math.round(percentile(s, 0.5)), p95Ms: Math.round(percentile(s, 0.95)), maxMs: Math.round(s.at(-1) ?? NaN) }
}
