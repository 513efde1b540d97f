import type { Logger } from 'pino'
import type { Database } from '@db/client'
import type { FileStore } from '../files/index'
import type { MailTransport } from './mail-transport'
import { storedFileBytes } from './stored-file'
import { attachmentsOf, claimNext, markFailed, markSent, requeue, type MessageRow } from './outbox.queries'

export interface WorkerOptions {
  /** The From address of every message. */
  from: string
  /** How long a claimed job is this worker's alone (5 minutes); longer than any SMTP timeout. */
  leaseMs?: number
  /** How often the queue is looked at when nothing kicks the worker (5 s). */
  pollMs?: number
  /** Sends before a message that keeps meeting a passing fault (a closed port, a 4xx) is marked failed (5). */
  maxAttempts?: number
  /** The wait before each further attempt after a passing fault. */
  backoffMs?: (attempt: number) => number
}

const DEFAULT_BACKOFF = (attempt: number) => [60_000, 5 * 60_000, 15 * 60_000, 60 * 60_000][attempt - 1] ?? 60 * 60_000

/**
 * Sends what the outbox holds. Each job is claimed once in the database, sent, then marked sent or
 * failed; any number of workers (one per app server) may run on one database. A worker that dies
 * mid-job leaves it "sending" until the lease runs out, then another takes it, with the same
 * Message-ID. The one window left: a crash after the SMTP server accepted a message and before
 * "sent" was written sends it again after the lease — at least once, never silently lost.
 */
export class OutboxWorker {
  private timer: NodeJS.Timeout | undefined
  private running: Promise<unknown> | undefined
  private again = false
  private stopped = false
  private readonly leaseMs: number
  private readonly maxAttempts: number
  private readonly backoff: (attempt: number) => number

  constructor(
    private readonly db: Database,
    private readonly transport: MailTransport,
    private readonly files: FileStore,
    private readonly log: Pick<Logger, 'info' | 'warn' | 'error'>,
    private readonly options: WorkerOptions,
  ) {
    this.leaseMs = options.leaseMs ?? 5 * 60_000
    this.maxAttempts = options.maxAttempts ?? 5
    this.backoff = options.backoffMs ?? DEFAULT_BACKOFF
  }

  /** Looks at the queue now and every `pollMs`. */
  start() {
    this.timer = setInterval(() => this.kick(), this.options.pollMs ?? 5_000)
    this.timer.unref()
    this.kick()
  }

  /** Something was queued or retried: send it soon, without waiting for the next poll. */
  kick() {
    if (this.stopped) return
    if (this.running) {
      this.again = true
      return
    }
    this.running = this.drain()
      .catch((err) => this.log.error({ err }, 'outbox: the worker stopped on an error; it tries again at the next poll'))
      .finally(() => {
        this.running = undefined
        if (this.again) {
          this.again = false
          this.kick()
        }
      })
  }

  /** Sends every due job, one at a time; resolves when none is left. */
  async drain(): Promise<number> {
    let sent = 0
    // Asked to stop, it takes no new job (a job claimed would wait out its lease).
    while (!this.stopped) {
      const job = await claimNext(this.db, this.leaseMs)
      if (!job) break
      if (await this.deliver(job)) sent++
    }
    return sent
  }

  /** Finishes the job in hand, then stops taking new ones. */
  async stop() {
    this.stopped = true
    clearInterval(this.timer)
    await this.running
    this.transport.close()
  }

  private async deliver(job: MessageRow): Promise<boolean> {
    let info
    try {
      info = await this.transport.send({
        from: this.options.from,
        to: { name: job.toName ?? '', address: job.toAddress },
        subject: job.subject,
        text: job.text,
        html: job.html ?? undefined,
        messageId: job.messageId,
        language: job.language,
        attachments: await this.attachments(job.id),
      })
    } catch (err) {
      await this.failed(job, err as SmtpError)
      return false
    }
    if (info.rejected.length > 0) {
      await this.failed(job, { message: `The server refused ${info.rejected.join(', ')}: ${info.response}`, responseCode: 550 })
      return false
    }
    if (!(await markSent(this.db, job, info.response))) {
      this.log.warn({ message: job.id }, 'outbox: sent, but the job had been taken over after its lease ran out')
    }
    return true
  }

  private async attachments(messageId: string) {
    const rows = await attachmentsOf(this.db, messageId)
    return Promise.all(
      rows.map(async (a) => ({ filename: a.filename, contentType: a.contentType, content: a.content ?? (await this.stored(a.fileId!)) })),
    )
  }

  private async stored(fileId: string) {
    const bytes = await storedFileBytes(this.db, this.files, fileId)
    if (!bytes) throw new Error(`The attached file ${fileId} is gone.`)
    return bytes
  }

  private async failed(job: MessageRow, err: SmtpError) {
    const reason = describe(err)
    // A 5xx answer is the server's final word on this message; anything else may pass.
    const permanent = typeof err.responseCode === 'number' && err.responseCode >= 500
    if (permanent || job.attempts >= this.maxAttempts) {
      await markFailed(this.db, job, reason)
      this.log.warn({ message: job.id, attempts: job.attempts, reason }, 'outbox: message failed')
    } else {
      await requeue(this.db, job, reason, this.backoff(job.attempts))
      this.log.info({ message: job.id, attempts: job.attempts, reason }, 'outbox: will try again')
    }
  }
}

interface SmtpError {
  message: string
  code?: string
  responseCode?: number
  response?: string
}

/** The reason in the SMTP server's own words when it gave one; never the message's content. */
function describe(err: SmtpError): string {
  const text = err.response ?? err.message ?? String(err)
  return (err.code && !text.includes(err.code) ? `${err.code}: ${text}` : text).slice(0, 1000)
}
