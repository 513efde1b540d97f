import type { Database } from '@db/client'
import type { Locale } from '@shared/messages/locales'
import { and, asc, eq, inArray } from 'drizzle-orm'
import { userYards, yards } from '@db/schema'
import type { CreateUser, UpdateUser, User } from '@shared/schemas/users'
import { conflict, fieldIssue, notFound, unprocessable, said } from '../errors'
import type { BoardNotifier } from '../live/index'
import { endSessionsOf, localeInSessions, renameInSessions } from '../session/index'
import { recordSettingsChange } from '../settings-audit/index'
import { hashPassword } from './passwords'
import * as q from './users.queries'

const toRow = (u: Awaited<ReturnType<typeof q.insertUser>>) => ({ ...u, createdAt: u.createdAt.toISOString() })

export async function listUsers(db: Database, actor: User) {
  const me = await q.findUser(db, actor.id)
  const [rows, chosen] = await Promise.all([q.listUsers(db, me!.companyId), q.chosenYardsOf(db, me!.companyId)])
  return rows.map((u) => ({ ...toRow(u), yardIds: u.allYards ? [] : (chosen.get(u.id) ?? []) }))
}

// Only the manager's own company is looked at: whether another company uses the address is not
// theirs to learn, and an account there does not stand in the way (sign-in tells them apart by password).
// The refusal is about the e-mail field: its issue puts the same words beside it.
const alreadyOnStaff = (email: string) => {
  const message = `${email} is already on your staff list. Find them there, or use another address.`
  return conflict(message, said('alreadyOnStaff', { email }, { issues: [fieldIssue('email', 'users.alreadyOnStaff', message, { email })] }))
}

export async function createUser(db: Database, actor: User, input: CreateUser) {
  const me = await q.findUser(db, actor.id)
  if (await q.findUserByEmailInCompany(db, me!.companyId, input.email)) throw alreadyOnStaff(input.email)
  const passwordHash = await hashPassword(input.password)
  try {
    const row = await q.insertUser(db, { companyId: me!.companyId, email: input.email, name: input.name, role: input.role, passwordHash })
    return toRow(row)
  } catch (err) {
    // Two managers adding the same person at once: the unique index decides.
    if (isUniqueViolation(err, 'users_company_email_lower')) throw alreadyOnStaff(input.email)
    throw err
  }
}

function isUniqueViolation(err: unknown, constraint: string): boolean {
  const e = ((err as { cause?: unknown })?.cause ?? err) as { code?: string; constraint?: string; message?: string }
  return e?.code === '23505' && (e.constraint === constraint || (e.message ?? '').includes(constraint))
}

export async function changeUser(db: Database, boards: BoardNotifier, actor: User, id: string, input: UpdateUser) {
  const endsSessions = input.active === false || input.role !== undefined
  const row = await db.transaction(async (tx) => {
    const target = await q.findUser(tx, id)
    const me = await q.findUser(tx, actor.id)
    if (!target || target.companyId !== me!.companyId) throw notFound('That user')
    const losesManager = target.role === 'manager' && target.active && (input.active === false || (input.role && input.role !== 'manager'))
    if (losesManager && (await q.countActiveManagers(tx, target.companyId)) <= 1) {
      throw unprocessable('The company must keep at least one active manager.', said('lastManager'))
    }
    const row = await q.updateUser(tx, id, input)
    if (endsSessions) await endSessionsOf(tx, id)
    else if (input.name) await renameInSessions(tx, id, input.name)
    return toRow(row!)
  })
  // Their open board streams too, on every app server.
  if (endsSessions) await boards.sessionsEnded({ userId: id })
  return row
}

/** A person's own language: saved with the account and written into their sessions, so every tab and server knows it. */
export async function setOwnLocale(db: Database, actor: User, locale: Locale): Promise<User> {
  return db.transaction(async (tx) => {
    const row = await q.updateUser(tx, actor.id, { locale })
    if (!row) throw notFound('That user')
    await localeInSessions(tx, actor.id, locale)
    return { id: row.id, email: row.email, name: row.name, role: row.role, locale }
  })
}

export async function resetPassword(db: Database, boards: BoardNotifier, actor: User, id: string, password: string) {
  const target = await q.findUser(db, id)
  const me = await q.findUser(db, actor.id)
  if (!target || target.companyId !== me!.companyId) throw notFound('That user')
  const passwordHash = await hashPassword(password)
  // Whoever knew the old password is signed out everywhere, in the same transaction as the change.
  await db.transaction(async (tx) => {
    await q.updateUser(tx, id, { passwordHash })
    await endSessionsOf(tx, id)
  })
  await boards.sessionsEnded({ userId: id })
}

/**
 * The yards a person works in: all of the company's, or the ones chosen. One transaction with its
 * settings-audit row; a yard of another company (or none at all) is "not found", as everywhere else.
 * Their access follows at once: every read goes through `yardOfStaff`, and the top bar's yard falls
 * back to their first when the chosen one is no longer theirs (`yardOfUser`).
 */
export async function setStaffYards(db: Database, actor: User, id: string, input: { allYards: boolean; yardIds: string[] }) {
  return db.transaction(async (tx) => {
    const target = await q.findUser(tx, id)
    const me = await q.findUser(tx, actor.id)
    if (!target || target.companyId !== me!.companyId) throw notFound('That user')
    const wanted = input.allYards ? [] : [...new Set(input.yardIds)]
    const found = wanted.length ? await tx.select({ id: yards.id, name: yards.name }).from(yards).where(and(inArray(yards.id, wanted), eq(yards.companyId, target.companyId))) : []
    if (found.length !== wanted.length) throw notFound('That yard')
    const before = await tx
      .select({ name: yards.name })
      .from(userYards)
      .innerJoin(yards, eq(yards.id, userYards.yardId))
      .where(eq(userYards.userId, id))
      .orderBy(asc(yards.name))
    await tx.delete(userYards).where(eq(userYards.userId, id))
    if (wanted.length) await tx.insert(userYards).values(wanted.map((yardId) => ({ userId: id, yardId })))
    const row = await q.updateUser(tx, id, { allYards: input.allYards })
    const view = (all: boolean, names: string[]) => ({ allYards: all, yards: all ? [] : names.sort() })
    await recordSettingsChange(tx, {
      companyId: target.companyId,
      actorId: actor.id,
      area: 'staff',
      action: 'staff-yards',
      subjectId: id,
      subjectLabel: target.name,
      before: view(target.allYards, before.map((b) => b.name)),
      after: view(input.allYards, found.map((f) => f.name)),
    })
    return { ...toRow(row!), yardIds: wanted }
  })
}
