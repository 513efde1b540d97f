import { asc, sql, type SQL } from 'drizzle-orm'
import type { Executor } from '@db/client'
import { users, yards } from '@db/schema'

/**
 * True for a yard row the staff member belongs to: one of their company's yards, and either all of
 * them (users.all_yards) or one the manager gave them (user_yards). Every read of a vehicle, file,
 * document or list by a signed-in person goes through this, so another yard's id is "not found"
 * exactly as another company's is. Use it where `yards` is in the query.
 */
export function yardOfStaff(userId: string): SQL {
  return sql`${yards.id} in (select y.id from yards y join users u on u.company_id = y.company_id
    where u.id = ${userId} and u.active and (u.all_yards or exists (select 1 from user_yards uy where uy.user_id = u.id and uy.yard_id = y.id)))`
}

/** The yards a staff member belongs to, oldest first (the order of the top bar's chooser). */
export function yardsOfUser(db: Executor, userId: string) {
  return db.select().from(yards).where(yardOfStaff(userId)).orderBy(asc(yards.createdAt), asc(yards.code))
}

/**
 * The yard a staff member works in now: the one chosen in the top bar when it is still theirs,
 * otherwise the first of their yards. Every list (board, reports, today, archive…) reads this one.
 */
export async function yardOfUser(db: Executor, userId: string) {
  // One query on every request that reads a list: the chosen yard sorts first (a yard that is no longer
  // theirs is not among the rows at all), then the oldest; `= null` when nothing is chosen sorts last.
  const [first] = await db
    .select()
    .from(yards)
    .where(yardOfStaff(userId))
    .orderBy(sql`${yards.id} = (select ${users.currentYardId} from ${users} where ${users.id} = ${userId}) desc nulls last`, asc(yards.createdAt), asc(yards.code))
    .limit(1)
  return first
}
