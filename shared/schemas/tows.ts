import { z } from 'zod'
import { TOW_REASONS } from '../domain/tow/tow-reasons'
import { alongsideFieldIssues, instantSchema, optionalInstant, optionalText, requiredText } from './fields'
import { msg } from './field-messages'

/** Arrival may be typed a little ahead of the server's clock; beyond that it is a typing mistake. */
const FUTURE_SLACK_MS = 10 * 60_000
/** An arrival further back than this is a mistyped year: nothing stays on a storage lot for a decade. */
const OLDEST_ARRIVAL_YEARS = 10

export const pickupSchema = z.object(
  {
    lat: z.number({ error: msg('tows.dropPinMapSearch', 'Drop a pin on the map or search for the address.') }).min(-90, msg('tows.latitudeBetween9090', 'Latitude is between -90 and 90.')).max(90, msg('tows.latitudeBetween9090', 'Latitude is between -90 and 90.')),
    lng: z.number({ error: msg('tows.dropPinMapSearch', 'Drop a pin on the map or search for the address.') }).min(-180, msg('tows.longitudeBetween180180', 'Longitude is between -180 and 180.')).max(180, msg('tows.longitudeBetween180180', 'Longitude is between -180 and 180.')),
    address: optionalText(200),
  },
  { error: msg('tows.dropPinMapSearch', 'Drop a pin on the map or search for the address.') },
)

/** Where, when, why and by whom: the tow itself, as the dispatcher records it. */
export const towSchema = z
  .object({
    pickup: pickupSchema,
    roadMiles: z.number({ error: msg('tows.enterRoadMilesAs', 'Enter road miles as a number.') }).min(0, msg('tows.roadMilesCannotNegative', 'Road miles cannot be negative.')).max(2000, msg('tows.roadMilesCannotAbove', 'Road miles cannot be above 2,000.')).nullish().transform((v) => v ?? null),
    winchingUnits: z.number({ error: msg('tows.enterWinchingAsNumber', 'Enter winching as a number of units.') }).int(msg('tows.winchingWholeNumberUnits', 'Winching is a whole number of units.')).min(0).max(40, msg('tows.winchingCannotAbove40', 'Winching cannot be above 40 units.')).default(0),
    dollies: z.boolean().default(false),
    afterHours: z.boolean().default(false),
    calledAt: optionalInstant,
    hookedAt: optionalInstant,
    arrivedAt: instantSchema,
    reason: z.enum(TOW_REASONS, { error: msg('tows.chooseWhyVehicleWas', 'Choose why the vehicle was towed.') }),
    reasonNote: optionalText(500),
    requesterName: requiredText(120, msg('tows.enterWhoAskedFor', 'Enter who asked for the tow.')),
    requesterAgency: optionalText(120),
    requesterReference: optionalText(60),
    truck: optionalText(80),
    driver: optionalText(80),
  })
  .superRefine((t, ctx) => {
    if (t.reason === 'other' && !t.reasonNote) ctx.addIssue({ code: 'custom', path: ['reasonNote'], message: msg('tows.sayWhatReasonWas', 'Say what the reason was.') })
    if (t.reason === 'law_enforcement' && !t.requesterAgency) {
      ctx.addIssue({ code: 'custom', path: ['requesterAgency'], message: msg('tows.nameAgencyThatAsked', 'Name the agency that asked for the tow.') })
    }
    // Also runs when another field is wrong: an unparsed time is NaN and compares false.
    const called = t.calledAt ? Date.parse(t.calledAt) : null
    const hooked = t.hookedAt ? Date.parse(t.hookedAt) : null
    const arrived = Date.parse(t.arrivedAt)
    if (called !== null && hooked !== null && hooked < called) {
      ctx.addIssue({ code: 'custom', path: ['hookedAt'], message: msg('tows.hookedUpCannotBefore', 'Hooked up cannot be before the call.') })
    }
    if ((hooked ?? called) !== null && arrived < (hooked ?? called)!) {
      ctx.addIssue({ code: 'custom', path: ['arrivedAt'], message: hooked !== null ? msg('tows.arrivalBeforeHookUp', 'Arrival at the gate cannot be before the hook-up.') : msg('tows.arrivalBeforeCall', 'Arrival at the gate cannot be before the call.') })
    }
    if (arrived > Date.now() + FUTURE_SLACK_MS) ctx.addIssue({ code: 'custom', path: ['arrivedAt'], message: msg('tows.arrivalAtGateCannot', 'Arrival at the gate cannot be in the future.') })
    const oldest = new Date()
    oldest.setFullYear(oldest.getFullYear() - OLDEST_ARRIVAL_YEARS)
    if (arrived < oldest.getTime()) {
      ctx.addIssue({ code: 'custom', path: ['arrivedAt'], message: msg('tows.arrivalTooOld', `Arrival at the gate cannot be more than ${OLDEST_ARRIVAL_YEARS} years ago: check the year.`, { years: OLDEST_ARRIVAL_YEARS }) })
    }
  }, alongsideFieldIssues)
export type TowInput = z.input<typeof towSchema>
export type Tow = z.output<typeof towSchema>

export const towLineSchema = z.object({
  code: z.string(),
  label: z.string(),
  quantity: z.number(),
  unitCents: z.number(),
  amountCents: z.number(),
  reason: z.string(),
  params: z.record(z.string(), z.union([z.string(), z.number()])).optional(),
})

/** A yard's tow rates (shared/domain/tow/tow-charge.ts TowRates); a yard that has none bills nothing yet. */
export const towRatesSchema = z.object({
  hookUpCents: z.number().int().nonnegative().default(0),
  perMileCents: z.number().int().nonnegative().default(0),
  includedMiles: z.number().nonnegative().optional(),
  winchingCentsPerUnit: z.number().int().nonnegative().optional(),
  dolliesCents: z.number().int().nonnegative().optional(),
  afterHoursCents: z.number().int().nonnegative().optional(),
})
