import { z } from 'zod'
import { joinBoardWords } from '../domain/board/board-words'
import { BOARD_COLUMNS, DISPOSITIONS, VEHICLE_STATES } from '../domain/lifecycle/columns'
import { HOLD_KINDS } from '../domain/lifecycle/hold-kinds'
import { nextDeadlineSchema, vehicleSummarySchema } from './charges'
import { pickupBadgeSchema } from './inspections'
import { OWNER_CHOICES } from './owner'

export const cardHoldSchema = z.object({
  kind: z.enum(HOLD_KINDS),
  agency: z.string().nullable(),
  caseNumber: z.string().nullable(),
  until: z.string().nullable(),
})

/**
 * What the yard has recorded toward handing the vehicle over: payments less refunds, approved waivers
 * and discounts (issue 11); the claimant's ID and the signed release arrive with the release.
 */
export const handoverSchema = z.object({
  paidCents: z.number(),
  creditedCents: z.number(),
  waived: z.boolean(),
  claimantIdRecorded: z.boolean(),
  releaseSigned: z.boolean(),
  /** The title transfer (bill of sale) signed: its own paper, never the release's signature. */
  transferSigned: z.boolean(),
  /** The lien sale recorded (buyer, price, proceeds) and its bill of sale signed. */
  lienSaleSigned: z.boolean(),
})

/** How a vehicle is named wherever it is listed: the board, the archive. */
export const vehicleIdentityShape = {
  id: z.uuid(),
  stockNumber: z.string(),
  year: z.number().nullable(),
  make: z.string().nullable(),
  model: z.string().nullable(),
  colour: z.string().nullable(),
  plate: z.string().nullable(),
  plateState: z.string().nullable(),
}

/**
 * The card's share of the running summary. The rule set's sample warnings and the counting rules a date
 * followed are the vehicle page's to show: a board of 2,000 cards would carry each of them 2,000 times.
 */
export const cardSummarySchema = vehicleSummarySchema.omit({ warnings: true, sampleWarnings: true }).extend({ nextDeadline: nextDeadlineSchema.omit({ rules: true }).nullable() })

/** The card's pickup badge: its words; the reasons behind it are on the vehicle page and the teardown screen. */
export const cardPickupSchema = pickupBadgeSchema.pick({ label: true, code: true, technicianFirst: true })

export const boardCardSchema = z.object({
  ...vehicleIdentityShape,
  state: z.enum(VEHICLE_STATES),
  disposition: z.enum(DISPOSITIONS).nullable(),
  /** Not shown on the card: the board's search finds a vehicle by it (issue 16 item 9). */
  vin: z.string().nullable(),
  version: z.number(),
  arrivedAt: z.string(),
  towReason: z.string().nullable(),
  space: z.string().nullable(),
  rolls: z.boolean().nullable(),
  inspectedAt: z.string().nullable(),
  holds: z.array(cardHoldSchema),
  handover: handoverSchema,
  photoCount: z.number(),
  /** What the pickup must bring (the teardown's roll marks); null until rolls, steers and brakes are marked. */
  pickup: cardPickupSchema.nullable(),
  /** Null when the vehicle has no rule set to bill it by (shown as "no rule set"). */
  summary: cardSummarySchema.nullable(),
  /** What the owner chose on their page, latest first; null until they choose. */
  ownerChoice: z.object({ choice: z.enum(OWNER_CHOICES), at: z.string() }).nullable(),
})
export type BoardCard = z.infer<typeof boardCardSchema>

export const boardSchema = z.object({
  /** The last live event this board already includes; the event stream resumes after it. */
  eventId: z.string(),
  yard: z.object({ id: z.uuid(), name: z.string(), timeZone: z.string() }),
  asOf: z.string(),
  columns: z.array(z.object({ column: z.enum(BOARD_COLUMNS), cards: z.array(boardCardSchema) })),
})
export type Board = z.infer<typeof boardSchema>

/** GET /api/board as sent: the rule set's words once, in `words`, put back on each card before it is read (shared/domain/board). */
export const boardBodySchema = z.preprocess(joinBoardWords, boardSchema)

/** One message on the board's live stream (GET /api/board/events). */
export const boardEventSchema = z.discriminatedUnion('type', [
  z.object({ type: z.literal('card'), card: boardCardSchema }),
  /** Closed (or gone from this yard): it leaves the board. */
  z.object({ type: z.literal('removed'), id: z.uuid() }),
  /** Events may have been missed: fetch the whole board again. */
  z.object({ type: z.literal('resync') }),
])
export type BoardEvent = z.infer<typeof boardEventSchema>
