import { and, asc, eq, inArray } from 'drizzle-orm'
import { alias } from 'drizzle-orm/pg-core'
import type { Executor } from '@db/client'
import { notices, noticeSendings, users, vehicleContacts } from '@db/schema'
import type { NoticeRecord } from '@shared/schemas/notices'

export type NoticeRow = typeof notices.$inferSelect

/** The vehicle's notice letters, oldest first, each with its recipient and every time it went out. */
export async function noticesOf(db: Executor, vehicleId: string): Promise<NoticeRecord[]> {
  const maker = alias(users, 'maker')
  const rows = await db
    .select({ n: notices, contact: { id: vehicleContacts.id, name: vehicleContacts.name, role: vehicleContacts.role }, by: maker.name })
    .from(notices)
    .innerJoin(vehicleContacts, eq(vehicleContacts.id, notices.contactId))
    .leftJoin(maker, eq(maker.id, notices.createdById))
    .where(eq(notices.vehicleId, vehicleId))
    .orderBy(asc(notices.createdAt))
  if (rows.length === 0) return []
  const sender = alias(users, 'sender')
  const sendings = await db
    .select({ s: noticeSendings, by: sender.name })
    .from(noticeSendings)
    .leftJoin(sender, eq(sender.id, noticeSendings.createdById))
    .where(inArray(noticeSendings.noticeId, rows.map((r) => r.n.id)))
    .orderBy(asc(noticeSendings.createdAt))
  return rows.map(({ n, contact, by }) => ({
    id: n.id,
    kind: n.kind,
    contact,
    language: n.language,
    dueDate: n.dueDate,
    nextDate: n.nextDate,
    fileId: n.fileId,
    createdAt: n.createdAt.toISOString(),
    createdBy: by ?? null,
    sendings: sendings
      .filter(({ s }) => s.noticeId === n.id)
      .map(({ s, by: sentBy }) => ({
        id: s.id,
        method: s.method,
        trackingNumber: s.trackingNumber,
        mailedOn: s.mailedOn,
        emailTo: s.emailTo,
        outboxMessageId: s.outboxMessageId,
        returnedOn: s.returnedOn,
        returnNote: s.returnNote,
        sentBy: sentBy ?? null,
        createdAt: s.createdAt.toISOString(),
      })),
  }))
}

export async function noticeOf(db: Executor, vehicleId: string, noticeId: string): Promise<NoticeRow | undefined> {
  const [row] = await db.select().from(notices).where(and(eq(notices.id, noticeId), eq(notices.vehicleId, vehicleId)))
  return row
}
