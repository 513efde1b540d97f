import { asc, count, eq, and, sql } from 'drizzle-orm'
import type { Executor } from '@db/client'
import { userYards, users } from '@db/schema'

const publicColumns = {
  id: users.id,
  email: users.email,
  name: users.name,
  role: users.role,
  active: users.active,
  createdAt: users.createdAt,
  allYards: users.allYards,
}

export const listUsers = (db: Executor, companyId: string) =>
  db.select(publicColumns).from(users).where(eq(users.companyId, companyId)).orderBy(asc(users.name))

/** Every account with this address, oldest first: an address is unique within a company only. */
export function findUsersByEmail(db: Executor, email: string) {
  return db
    .select()
    .from(users)
    .where(eq(sql`lower(${users.email})`, email.toLowerCase()))
    .orderBy(asc(users.createdAt), asc(users.id))
}

export async function findUserByEmailInCompany(db: Executor, companyId: string, email: string) {
  const [row] = await db
    .select()
    .from(users)
    .where(and(eq(users.companyId, companyId), eq(sql`lower(${users.email})`, email.toLowerCase())))
  return row
}

export async function findUser(db: Executor, id: string) {
  const [row] = await db.select().from(users).where(eq(users.id, id))
  return row
}

export async function insertUser(db: Executor, values: typeof users.$inferInsert) {
  const [row] = await db.insert(users).values(values).returning(publicColumns)
  return row!
}

export async function updateUser(db: Executor, id: string, values: Partial<typeof users.$inferInsert>) {
  const [row] = await db.update(users).set({ ...values, updatedAt: new Date() }).where(eq(users.id, id)).returning(publicColumns)
  return row
}

export async function countActiveManagers(db: Executor, companyId: string) {
  const [row] = await db
    .select({ n: count() })
    .from(users)
    .where(and(eq(users.companyId, companyId), eq(users.role, 'manager'), eq(users.active, true)))
  return row?.n ?? 0
}

export async function companyOf(db: Executor, userId: string): Promise<string> {
  const [row] = await db.select({ companyId: users.companyId }).from(users).where(eq(users.id, userId))
  if (!row) throw new Error(`no user ${userId}`)
  return row.companyId
}

/** The yards chosen for each person of a company who does not have all yards. */
export async function chosenYardsOf(db: Executor, companyId: string): Promise<Map<string, string[]>> {
  const rows = await db
    .select({ userId: userYards.userId, yardId: userYards.yardId })
    .from(userYards)
    .innerJoin(users, eq(users.id, userYards.userId))
    .where(eq(users.companyId, companyId))
  const byUser = new Map<string, string[]>()
  for (const r of rows) byUser.set(r.userId, [...(byUser.get(r.userId) ?? []), r.yardId])
  return byUser
}
