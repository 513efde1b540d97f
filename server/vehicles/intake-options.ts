import { and, asc, eq } from 'drizzle-orm'
import type { Database } from '@db/client'
import { users } from '@db/schema'
import type { IntakeOptions } from '@shared/schemas/tow-in'
import { notFound } from '../errors'
import { yardOfUser } from '../yards/index'
import { intakeRules, yardTowRates } from './rules'

/** What the tow-in form needs to offer: yard position and rates, billing classes, who can check a vehicle. */
export async function intakeOptions(db: Database, userId: string): Promise<IntakeOptions> {
  const yard = await yardOfUser(db, userId)
  if (!yard) throw notFound('A yard for your company')
  const rules = await intakeRules(db, yard)
  const staff = await db
    .select({ id: users.id, name: users.name, role: users.role })
    .from(users)
    .where(and(eq(users.companyId, yard.companyId), eq(users.active, true)))
    .orderBy(asc(users.name))
  const { rates, ratesSet } = yardTowRates(yard)
  return {
    yard: { id: yard.id, name: yard.name, code: yard.code, lat: yard.lat, lng: yard.lng, timeZone: yard.timeZone, towRates: rates, ratesSet },
    ruleSet: rules.ruleSet,
    policeNotice: rules.policeNotice,
    vehicleClasses: rules.classes,
    staff,
  }
}
