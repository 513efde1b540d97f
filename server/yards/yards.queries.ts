import { asc, eq } from 'drizzle-orm'
import type { Executor } from '@db/client'
import { users, yards } from '@db/schema'

/** The yard a staff member works in: the first of their company's yards until users pick one. */
export async function yardOfUser(db: Executor, userId: string) {
  const [row] = await db
    .select({ yard: yards })
    .from(yards)
    .innerJoin(users, eq(users.companyId, yards.companyId))
    .where(eq(users.id, userId))
    .orderBy(asc(yards.createdAt), asc(yards.code))
    .limit(1)
  return row?.yard
}
