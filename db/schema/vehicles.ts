import { sql } from 'drizzle-orm'
import { boolean, check, index, integer, pgTable, text, uniqueIndex, uuid } from 'drizzle-orm/pg-core'
import { DISPOSITIONS, VEHICLE_STATES } from '@shared/domain/lifecycle'
import { OWNER_CHOICES } from '@shared/schemas/owner'
import { users } from './users'
import { yardSpaces, yards } from './yards'
import { at, createdAt, id } from './columns'

export const vehicles = pgTable(
  'vehicles',
  {
    id: id(),
    yardId: uuid().notNull().references(() => yards.id),
    stockNumber: text().notNull().unique(),
    vin: text(),
    vinOverrideReason: text(),
    plate: text(),
    plateState: text(),
    year: integer(),
    make: text(),
    model: text(),
    colour: text(),
    body: text(),
    vehicleClass: text().notNull().default('standard'),
    odometer: integer(),
    odometerUnreadable: boolean().notNull().default(false),
    keys: text({ enum: ['yes', 'no', 'unknown'] }).notNull().default('unknown'),
    keysWhere: text(),
    drivableAsFound: boolean(),
    // Set by the technician at teardown; null until inspected.
    rolls: boolean(),
    steers: boolean(),
    brakes: boolean(),
    // When the technician finished the inspection, and who: a vehicle leaves Teardown only after it.
    inspectedAt: at(),
    inspectedById: uuid().references(() => users.id),
    state: text({ enum: VEHICLE_STATES }).notNull().default('arrival'),
    disposition: text({ enum: DISPOSITIONS }),
    version: integer().notNull().default(1),
    spaceId: uuid().references(() => yardSpaces.id),
    conditionNotes: text(),
    checkedById: uuid().references(() => users.id),
    ruleSetVersionId: uuid(),
    ownerName: text(),
    // The value the lien clocks branch on, and where it came from (a price guide, an appraisal, the inspection).
    estimatedValueCents: integer(),
    // The owner's latest choice on their page (owner_decisions holds each one in full): the board's badge.
    ownerChoice: text({ enum: OWNER_CHOICES }),
    ownerChoiceAt: at(),
    estimatedValueSource: text(),
    arrivedAt: at().notNull(),
    closedAt: at(),
    createdAt: createdAt(),
    updatedAt: at().notNull().defaultNow(),
  },
  (t) => [
    // A space holds one vehicle at a time; a closed vehicle gives its space back.
    uniqueIndex('vehicles_space_occupied').on(t.spaceId).where(sql`${t.spaceId} is not null`),
    index('vehicles_yard_state').on(t.yardId, t.state),
    // The archive lists a yard's closed vehicles, most recently closed first.
    index('vehicles_yard_closed').on(t.yardId, t.closedAt.desc()).where(sql`${t.state} = 'closed'`),
    index('vehicles_plate').on(t.plate),
    index('vehicles_vin').on(t.vin),
    check('vehicles_closed_has_disposition', sql`(${t.state} = 'closed') = (${t.disposition} is not null)`),
    check('vehicles_closed_has_no_space', sql`${t.state} <> 'closed' or ${t.spaceId} is null`),
    check('vehicles_version_positive', sql`${t.version} > 0`),
  ],
)
