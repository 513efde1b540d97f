import { randomUUID } from 'node:crypto'
import { mkdir, writeFile } from 'node:fs/promises'
import type { AddressInfo } from 'node:net'
import path from 'node:path'
import { SMTPServer } from 'smtp-server'

export interface ReceivedMail {
  id: string
  from: string | null
  to: string[]
  raw: Buffer
  receivedAt: Date
}

export interface LocalSmtp {
  /** smtp://127.0.0.1:<port>: what SMTP_URL would be for a real server. */
  url: string
  /** Every message received since start (the newest last); the folder keeps them across restarts. */
  received: ReceivedMail[]
  close(): Promise<void>
}

// Reserved by RFC 2606: a domain that can never receive mail. The stand-in refuses it the way a real
// server refuses a recipient it does not know, so a failed message can be seen (and retried) offline.
const UNDELIVERABLE = /\.invalid$/i

/**
 * The local stand-in for an SMTP relay: loopback only, no TLS or login, keeps every message it is given
 * (in memory and, with `folder`, as one .eml file each). The app sends to it through the same
 * nodemailer transport it would use for a real relay.
 */
export async function startLocalSmtp(options: { folder?: string; port?: number; maxSize?: number } = {}): Promise<LocalSmtp> {
  const received: ReceivedMail[] = []
  const maxSize = options.maxSize ?? 25 * 1024 * 1024
  if (options.folder) await mkdir(options.folder, { recursive: true, mode: 0o700 })
  const server = new SMTPServer({
    disabledCommands: ['STARTTLS', 'AUTH'],
    authOptional: true,
    size: maxSize,
    banner: 'Holdfast local mail stand-in',
    logger: false,
    onRcptTo(address, _session, callback) {
      if (UNDELIVERABLE.test(address.address.split('@')[1] ?? '')) {
        const err = Object.assign(new Error(`<${address.address}>: no such mailbox here (the domain .invalid never receives mail)`), { responseCode: 550 })
        return callback(err)
      }
      callback()
    },
    onData(stream, session, callback) {
      const chunks: Buffer[] = []
      stream.on('data', (c: Buffer) => chunks.push(c))
      stream.on('end', () => {
        if (stream.sizeExceeded) {
          return callback(Object.assign(new Error('Message is larger than this server accepts'), { responseCode: 552 }))
        }
        const mail: ReceivedMail = {
          id: randomUUID(),
          from: session.envelope.mailFrom ? session.envelope.mailFrom.address : null,
          to: session.envelope.rcptTo.map((r) => r.address),
          raw: Buffer.concat(chunks),
          receivedAt: new Date(),
        }
        const kept = options.folder
          ? writeFile(path.join(options.folder, `${mail.receivedAt.toISOString().replace(/[:.]/g, '-')}-${mail.id}.eml`), mail.raw, { mode: 0o600 })
          : Promise.resolve()
        kept.then(
          () => {
            received.push(mail)
            callback(null, `Kept as ${mail.id}`)
          },
          (err: Error) => callback(Object.assign(new Error(`Could not keep the message: ${err.message}`), { responseCode: 451 })),
        )
      })
    },
  })
  await new Promise<void>((resolve, reject) => {
    server.once('error', reject)
    server.listen(options.port ?? 0, '127.0.0.1', () => {
      server.off('error', reject)
      resolve()
    })
  })
  const { port } = server.server.address() as AddressInfo
  return {
    url: `smtp://127.0.0.1:${port}`,
    received,
    close: () => new Promise<void>((resolve) => server.close(() => resolve())),
  }
}
