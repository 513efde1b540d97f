import type { Executor } from '@db/client'
import { MESSAGE_STATUSES, type MessageStatus, type OutboxMessage, type OutboxPage, type OutboxRow } from '@shared/schemas/outbox'
import { conflict, notFound, said } from '../errors'
import { attachmentsOf, countsByStatus, listMessages, messageOf, retryMessage, type OutboxScope } from './outbox.queries'

type Listed = NonNullable<Awaited<ReturnType<typeof messageOf>>>

function rowOf({ message: m, stockNumber, queuedBy, attachmentCount }: Listed): OutboxRow {
  return {
    id: m.id,
    to: m.toAddress,
    toName: m.toName,
    subject: m.subject,
    purpose: m.purpose,
    language: m.language,
    status: m.status,
    attempts: m.attempts,
    lastError: m.lastError,
    vehicle: m.vehicleId && stockNumber ? { id: m.vehicleId, stockNumber } : null,
    queuedBy: queuedBy ?? null,
    createdAt: m.createdAt.toISOString(),
    sentAt: m.sentAt?.toISOString() ?? null,
    attachmentCount,
  }
}

export async function outboxPage(db: Executor, scope: OutboxScope, status: MessageStatus | null, page: number, pageSize: number): Promise<OutboxPage> {
  const { rows, total } = await listMessages(db, scope, status, { limit: pageSize, offset: (page - 1) * pageSize })
  const counts = Object.fromEntries(MESSAGE_STATUSES.map((s) => [s, 0])) as Record<MessageStatus, number>
  for (const c of await countsByStatus(db, scope)) counts[c.status] = c.n
  return { rows: rows.map(rowOf), total, page, pageSize, counts }
}

export async function outboxMessage(db: Executor, scope: OutboxScope, messageId: string): Promise<OutboxMessage> {
  const found = await messageOf(db, scope, messageId)
  if (!found) throw notFound('That message')
  const m = found.message
  return {
    ...rowOf(found),
    messageId: m.messageId,
    text: m.text,
    html: m.html,
    smtpResponse: m.smtpResponse,
    updatedAt: m.updatedAt.toISOString(),
    nextAttemptAt: m.status === 'queued' ? m.nextAttemptAt.toISOString() : null,
    attachments: (await attachmentsOf(db, m.id)).map((a) => ({ id: a.id, filename: a.filename, contentType: a.contentType, bytes: a.bytes })),
  }
}

/** Only a failed message can be sent again; a queued or sent one is left as it is (409). */
export async function retryFailed(db: Executor, scope: OutboxScope, messageId: string, userId: string): Promise<OutboxMessage> {
  if (!(await retryMessage(db, scope, messageId, userId))) {
    const current = await messageOf(db, scope, messageId)
    if (!current) throw notFound('That message')
    throw conflict(`This message is ${current.message.status}: only a failed message can be sent again.`, said('onlyFailedRetry'))
  }
  return outboxMessage(db, scope, messageId)
}
