import nodemailer from 'nodemailer'

export interface OutgoingMail {
  from: string
  to: { name: string; address: string }
  subject: string
  text: string
  html?: string
  messageId: string
  language: string
  attachments: { filename: string; content: Buffer; contentType: string }[]
}

export interface SentInfo {
  response: string
  rejected: string[]
}

/** The one way mail leaves Holdfast: to SMTP_URL, or to the local stand-in (server/fakes/) by the same code. */
export interface MailTransport {
  send(mail: OutgoingMail): Promise<SentInfo>
  close(): void
}

// Well under the outbox's lease (5 minutes): a send gives up long before another server may take the job over.
export const SMTP_TIMEOUTS = { connectionTimeout: 30_000, greetingTimeout: 30_000, socketTimeout: 120_000 }

export function smtpTransport(url: string): MailTransport {
  const parsed = new URL(url)
  // The local stand-in speaks plain SMTP on loopback (STACK.md); a real relay is told by its URL
  // (smtps:// for TLS from the start, smtp:// upgrades with STARTTLS when offered).
  const loopback = parsed.hostname === '127.0.0.1' || parsed.hostname === 'localhost' || parsed.hostname === '::1'
  const transporter = nodemailer.createTransport({
    url,
    ...SMTP_TIMEOUTS,
    ...(loopback && parsed.protocol === 'smtp:' ? { secure: false, ignoreTLS: true } : {}),
  })
  return {
    async send(mail) {
      const info = await transporter.sendMail({
        from: mail.from,
        to: mail.to.name ? { name: mail.to.name, address: mail.to.address } : mail.to.address,
        subject: mail.subject,
        text: mail.text,
        html: mail.html,
        messageId: mail.messageId,
        headers: { 'Content-Language': mail.language },
        attachments: mail.attachments,
        disableFileAccess: true,
        disableUrlAccess: true,
      })
      return { response: String(info.response ?? ''), rejected: (info.rejected ?? []).map(String) }
    },
    close: () => transporter.close(),
  }
}
