import { createHash, randomUUID } from 'node:crypto'
import { and, asc, count, desc, eq, inArray, isNull, lt, lte, or, sql } from 'drizzle-orm'
import type { Executor } from '@db/client'
import { files, outboundAttachments, outboundMessages, users, vehicles } from '@db/schema'
import { newMessageSchema, type MessageStatus, type NewMessage } from '@shared/schemas/outbox'

export type MessageRow = typeof outboundMessages.$inferSelect

/** The Message-ID's right-hand side; any stable name of this application will do. */
const MESSAGE_ID_DOMAIN = 'holdfast.outbox'

/**
 * Queues a message; nothing is sent here. Call it with the transaction that makes the change the
 * message is about, so the two are committed together or not at all. Kick the worker after the commit.
 */
export async function queueMessage(db: Executor, companyId: string, queuedById: string | null, input: NewMessage): Promise<MessageRow> {
  const m = newMessageSchema.parse(input)
  const id = randomUUID()
  const [row] = await db
    .insert(outboundMessages)
    .values({
      id,
      companyId,
      vehicleId: m.vehicleId,
      queuedById,
      purpose: m.purpose,
      toAddress: m.to,
      toName: m.toName,
      subject: m.subject,
      text: m.text,
      html: m.html,
      language: m.language,
      messageId: `<${id}@${MESSAGE_ID_DOMAIN}>`,
    })
    .returning()
  if (m.attachments.length > 0) {
    const fileIds = m.attachments.flatMap((a) => (a.fileId ? [a.fileId] : []))
    const stored = fileIds.length ? await db.select().from(files).where(inArray(files.id, fileIds)) : []
    await db.insert(outboundAttachments).values(
      m.attachments.map((a, position) => {
        if (a.content) {
          const content = Buffer.from(a.content)
          return { messageId: id, position, filename: a.filename, contentType: a.contentType, bytes: content.length, sha256: sha256(content), content }
        }
        const file = stored.find((f) => f.id === a.fileId)
        if (!file) throw new Error(`attachment file ${a.fileId} does not exist`)
        return { messageId: id, position, filename: a.filename, contentType: a.contentType, bytes: file.bytes, sha256: file.sha256, fileId: file.id }
      }),
    )
  }
  return row!
}

const sha256 = (b: Buffer) => createHash('sha256').update(b).digest('hex')

/**
 * Takes one due job for this worker: a queued message whose time has come, or one left "sending" by a
 * worker whose lease ran out (it died mid-send). One UPDATE with FOR UPDATE SKIP LOCKED, so two
 * servers on one PostgreSQL never take the same row; the database's clock judges every lease.
 */
export async function claimNext(db: Executor, leaseMs: number): Promise<MessageRow | undefined> {
  const m = outboundMessages
  const due = db
    .select({ id: m.id })
    .from(m)
    .where(or(and(eq(m.status, 'queued'), lte(m.nextAttemptAt, sql`now()`)), and(eq(m.status, 'sending'), lt(m.leaseUntil, sql`now()`))))
    .orderBy(asc(m.nextAttemptAt))
    .limit(1)
    .for('update', { skipLocked: true })
  const [row] = await db
    .update(m)
    .set({
      status: 'sending',
      claimToken: randomUUID(),
      leaseUntil: sql`now() + ${leaseMs} * interval '1 millisecond'`,
      attempts: sql`${m.attempts} + 1`,
      updatedAt: sql`now()`,
    })
    .where(inArray(m.id, due))
    .returning()
  return row
}

/** Ends a claim; a claim someone else has taken over since (its lease ran out) is left to them. */
async function finish(db: Executor, job: MessageRow, values: Partial<typeof outboundMessages.$inferInsert>) {
  const done = await db
    .update(outboundMessages)
    .set({ ...values, claimToken: null, leaseUntil: null, updatedAt: sql`now()` })
    .where(and(eq(outboundMessages.id, job.id), eq(outboundMessages.status, 'sending'), eq(outboundMessages.claimToken, job.claimToken!)))
    .returning({ id: outboundMessages.id })
  return done.length === 1
}

export const markSent = (db: Executor, job: MessageRow, smtpResponse: string) =>
  finish(db, job, { status: 'sent', sentAt: sql`now()` as unknown as Date, smtpResponse, lastError: null })

export const markFailed = (db: Executor, job: MessageRow, error: string) => finish(db, job, { status: 'failed', lastError: error })

export const requeue = (db: Executor, job: MessageRow, error: string, delayMs: number) =>
  finish(db, job, { status: 'queued', lastError: error, nextAttemptAt: sql`now() + ${delayMs} * interval '1 millisecond'` as unknown as Date })

/** What a staff member's Outbox shows: their company's messages about a vehicle of the yard chosen in the top bar, and those about no vehicle. */
export type OutboxScope = { companyId: string; yardId: string }

const inScope = (scope: OutboxScope) =>
  and(
    eq(outboundMessages.companyId, scope.companyId),
    or(isNull(outboundMessages.vehicleId), sql`${outboundMessages.vehicleId} in (select id from vehicles where yard_id = ${scope.yardId})`),
  )

/** A failed message goes back in the queue as it was, with the same Message-ID; the worker starts counting its attempts again. */
export async function retryMessage(db: Executor, scope: OutboxScope, messageId: string, userId: string) {
  const [row] = await db
    .update(outboundMessages)
    .set({ status: 'queued', attempts: 0, nextAttemptAt: sql`now()`, retriedById: userId, retriedAt: sql`now()`, updatedAt: sql`now()` })
    .where(and(eq(outboundMessages.id, messageId), inScope(scope), eq(outboundMessages.status, 'failed')))
    .returning({ id: outboundMessages.id })
  return row !== undefined
}

export async function attachmentsOf(db: Executor, messageId: string) {
  return db.select().from(outboundAttachments).where(eq(outboundAttachments.messageId, messageId)).orderBy(asc(outboundAttachments.position))
}

export async function attachmentOf(db: Executor, scope: OutboxScope, messageId: string, attachmentId: string) {
  const [row] = await db
    .select({ attachment: outboundAttachments })
    .from(outboundAttachments)
    .innerJoin(outboundMessages, eq(outboundMessages.id, outboundAttachments.messageId))
    .where(and(eq(outboundAttachments.id, attachmentId), eq(outboundMessages.id, messageId), inScope(scope)))
  return row?.attachment
}

const listColumns = {
  message: outboundMessages,
  stockNumber: vehicles.stockNumber,
  queuedBy: users.name,
  attachmentCount: sql<number>`(select count(*)::int from ${outboundAttachments} where ${outboundAttachments.messageId} = ${outboundMessages.id})`,
}

export async function listMessages(db: Executor, scope: OutboxScope, status: MessageStatus | null, page: { limit: number; offset: number }) {
  const where = and(inScope(scope), status ? eq(outboundMessages.status, status) : undefined)
  const rows = await db
    .select(listColumns)
    .from(outboundMessages)
    .leftJoin(vehicles, eq(vehicles.id, outboundMessages.vehicleId))
    .leftJoin(users, eq(users.id, outboundMessages.queuedById))
    .where(where)
    .orderBy(desc(outboundMessages.createdAt), desc(outboundMessages.id))
    .limit(page.limit)
    .offset(page.offset)
  const [total] = await db.select({ n: count() }).from(outboundMessages).where(where)
  return { rows, total: total!.n }
}

export async function countsByStatus(db: Executor, scope: OutboxScope) {
  return db
    .select({ status: outboundMessages.status, n: count() })
    .from(outboundMessages)
    .where(inScope(scope))
    .groupBy(outboundMessages.status)
}

export async function messageOf(db: Executor, scope: OutboxScope, messageId: string) {
  const [row] = await db
    .select(listColumns)
    .from(outboundMessages)
    .leftJoin(vehicles, eq(vehicles.id, outboundMessages.vehicleId))
    .leftJoin(users, eq(users.id, outboundMessages.queuedById))
    .where(and(eq(outboundMessages.id, messageId), inScope(scope)))
  return row
}
