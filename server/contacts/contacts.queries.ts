import { and, asc, eq, isNull } from 'drizzle-orm'
import type { Executor } from '@db/client'
import { recordsRequests, users, vehicleContacts } from '@db/schema'
import type { ContactRecord, RecordsRequestRecord } from '@shared/schemas/contacts'

export type ContactRow = typeof vehicleContacts.$inferSelect

export function contactRecord(c: ContactRow): ContactRecord {
  return {
    id: c.id,
    role: c.role,
    name: c.name,
    street: c.street,
    city: c.city,
    state: c.state,
    zip: c.zip,
    phone: c.phone,
    email: c.email,
    language: c.language,
    source: c.source,
    sourceDate: c.sourceDate,
    sourceNote: c.sourceNote,
    createdAt: c.createdAt.toISOString(),
    updatedAt: c.updatedAt.toISOString(),
  }
}

/** The vehicle's contacts still on record, owners first, in the order they were added. */
export async function contactsOf(db: Executor, vehicleId: string): Promise<ContactRecord[]> {
  const rows = await db
    .select()
    .from(vehicleContacts)
    .where(and(eq(vehicleContacts.vehicleId, vehicleId), isNull(vehicleContacts.removedAt)))
    .orderBy(asc(vehicleContacts.createdAt))
  const order = { registered_owner: 0, lienholder: 1, insurer: 2, interested_party: 3 } as const
  return rows.sort((a, b) => order[a.role] - order[b.role]).map(contactRecord)
}

export async function contactOf(db: Executor, vehicleId: string, contactId: string): Promise<ContactRow | undefined> {
  const [row] = await db
    .select()
    .from(vehicleContacts)
    .where(and(eq(vehicleContacts.id, contactId), eq(vehicleContacts.vehicleId, vehicleId), isNull(vehicleContacts.removedAt)))
  return row
}

export async function recordsRequestsOf(db: Executor, vehicleId: string): Promise<RecordsRequestRecord[]> {
  const rows = await db
    .select({ r: recordsRequests, by: users.name })
    .from(recordsRequests)
    .leftJoin(users, eq(users.id, recordsRequests.createdById))
    .where(eq(recordsRequests.vehicleId, vehicleId))
    .orderBy(asc(recordsRequests.sentOn), asc(recordsRequests.createdAt))
  return rows.map(({ r, by }) => ({ id: r.id, agency: r.agency, sentOn: r.sentOn, answeredOn: r.answeredOn, outcome: r.outcome, recordedBy: by ?? null }))
}
