import { Router } from 'express'
import { and, eq, ne, sql } from 'drizzle-orm'
import type { Database } from '@db/client'
import { vehicles, yards } from '@db/schema'
import { lookupInputSchema, type LookupAnswer } from '@shared/schemas/owner'
import { moneyTotals } from '../billing/index'
import { summarizeVehicles } from '../charges/index'
import type { PublicThrottle } from './public-throttle'

/**
 * POST /api/vehicle-lookup — "Is my vehicle here?": a plate and the end of its VIN. The answer says
 * only whether a yard on this server holds it, where to come and what is owed; every try counts
 * against the address (public-throttle.ts), found or not, so plates cannot be trawled.
 */
export function lookupRouter(db: Database, throttle: PublicThrottle): Router {
  const router = Router()
  router.post('/', async (req, res) => {
    const ip = req.ip ?? ''
    await throttle.check('lookup', ip, res)
    // Counted before reading it: a malformed try is a try too.
    await throttle.count('lookup', ip)
    const { plate, vinTail } = lookupInputSchema.parse(req.body)
    res.setHeader('Cache-Control', 'private, no-store')
    const rows = await db
      .select({ vehicle: vehicles, yard: yards })
      .from(vehicles)
      .innerJoin(yards, eq(yards.id, vehicles.yardId))
      .where(
        and(
          ne(vehicles.state, 'closed'),
          sql`upper(regexp_replace(${vehicles.plate}, '[\\s-]', '', 'g')) = ${plate}`,
          sql`right(upper(${vehicles.vin}), ${vinTail.length}) = ${vinTail}`,
        ),
      )
      .limit(2)
    // Two vehicles matching would mean the tail is too short to tell them apart: say nothing about either.
    if (rows.length !== 1) return void res.json({ found: false } satisfies LookupAnswer)
    const { vehicle, yard } = rows[0]!
    const now = new Date()
    const summary = (await summarizeVehicles(db, yard, [vehicle], now)).get(vehicle.id)
    // What is still owed: the charges less what was paid and what a manager waived (issue 11).
    const money = (await moneyTotals(db, [vehicle.id])).get(vehicle.id)
    res.json({
      found: true,
      yard: { name: yard.name, address: yard.address, phone: yard.phone, hours: yard.hours },
      balanceCents: summary ? Math.max(0, summary.balanceCents - (money?.creditedCents ?? 0) - (money?.paidCents ?? 0)) : null,
      asOf: now.toISOString(),
    } satisfies LookupAnswer)
  })
  return router
}
