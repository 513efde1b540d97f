import { count, sql } from 'drizzle-orm'
import type { Database, Executor } from '@db/client'
import { companies } from '@db/schema'
import type { z } from 'zod'
import type { firstRunSchema } from '@shared/schemas/first-run'
import { conflict, said } from '../errors'
import { recordSettingsChange } from '../settings-audit/index'
import { hashPassword, insertUser } from '../users/index'
import { insertSpaces } from '../yard-settings/index'
import { createYard } from '../yards/index'

type FirstRun = z.output<typeof firstRunSchema>

const alreadySetUp = () => conflict('This Holdfast is already set up. Sign in with your account.', said('alreadySetUp'))

/** True while no company exists: the first-run page is offered, and its route is open, only then. */
export async function firstRunNeeded(db: Executor): Promise<boolean> {
  const [row] = await db.select({ n: count() }).from(companies)
  return row!.n === 0
}

/** Refuses (409) once a company exists: what the first run offers is of use only before that. */
export async function stillNeeded(db: Executor): Promise<void> {
  if (!(await firstRunNeeded(db))) throw alreadySetUp()
}

/**
 * The company, its first manager, first yard and spaces, with the yard's settings-audit row: all or
 * nothing, through the same services as `user:create` and Settings → Yards. Two first runs at once
 * make one company: the table lock makes the second wait for the first, then see its company (409).
 */
export async function setUpFirstCompany(db: Database, input: FirstRun, ruleSetsFolder?: string) {
  if (!(await firstRunNeeded(db))) throw alreadySetUp()
  const passwordHash = await hashPassword(input.password)
  return db.transaction(async (tx) => {
    await tx.execute(sql`lock table ${companies} in share row exclusive mode`)
    if (!(await firstRunNeeded(tx))) throw alreadySetUp()
    const [company] = await tx.insert(companies).values({ name: input.companyName }).returning()
    const user = await insertUser(tx, { companyId: company!.id, email: input.email, name: input.name, role: 'manager', passwordHash })
    const setup = { name: input.yardName, code: input.code, address: input.address, lat: input.lat, lng: input.lng, timeZone: input.timeZone, ruleSet: input.ruleSet }
    const yard = await createYard(tx, company!.id, setup, ruleSetsFolder)
    const spaces = await insertSpaces(tx, yard.id, { firstRow: 'A', rows: input.rows, perRow: input.perRow, size: 'standard' })
    await recordSettingsChange(tx, {
      companyId: company!.id,
      actorId: user.id,
      area: 'yard',
      action: 'yard-added',
      subjectId: yard.id,
      subjectLabel: yard.name,
      after: { ...setup, spaces },
    })
    return { user: { id: user.id, email: user.email, name: user.name, role: user.role }, yardId: yard.id }
  })
}
