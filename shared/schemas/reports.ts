import { z } from 'zod'
import { BOARD_COLUMNS } from '../domain/lifecycle/columns'
import { lienSaleEligibleSchema } from './charges'
import { msg } from './field-messages'

const vehicleShape = {
  vehicleId: z.uuid(),
  stockNumber: z.string(),
  vehicle: z.string(),
  plate: z.string().nullable(),
  state: z.enum(BOARD_COLUMNS),
  arrivedAt: z.string(),
}

// ---------------------------------------------------------------- receivables

export const RECEIVABLE_SORTS = ['stockNumber', 'arrivedAt', 'daysOnLot', 'storageCents', 'paidCents', 'dueCents', 'nextDeadline'] as const
export type ReceivableSort = (typeof RECEIVABLE_SORTS)[number]

/** One vehicle on the lot with money still owed: its bill so far, what was paid or credited, what is due. */
export const receivableRowSchema = z.object({
  ...vehicleShape,
  /** Storage days counted so far by the rule set's own day rule. */
  daysOnLot: z.number().int(),
  towCents: z.number().int(),
  storageCents: z.number().int(),
  /** Everything charged so far (tow, storage, fees, tax): the invoice's total. */
  chargesCents: z.number().int(),
  creditedCents: z.number().int(),
  paidCents: z.number().int(),
  dueCents: z.number().int(),
  nextDeadline: z.object({ label: z.string(), dueDate: z.string(), daysLeft: z.number() }).nullable(),
})
export type ReceivableRow = z.infer<typeof receivableRowSchema>

const totalsSchema = z.object({
  count: z.number().int(),
  chargesCents: z.number().int(),
  storageCents: z.number().int(),
  creditedCents: z.number().int(),
  paidCents: z.number().int(),
  dueCents: z.number().int(),
})

const intParam = (name: string, min: number, max: number, fallback: number) =>
  z.coerce
    .number({ error: msg('reports.wholeNumber', `${name} must be a whole number.`, { name }) })
    .int({ error: msg('reports.wholeNumber', `${name} must be a whole number.`, { name }) })
    .min(min, { error: msg('reports.atLeast', `${name} must be at least ${min}.`, { name, min }) })
    .max(max, { error: msg('reports.atMost', `${name} must be at most ${max}.`, { name, max }) })
    .default(fallback)

/** Filters, sorting and paging of the receivables, shared by the page and its CSV (which ignores paging). */
export const receivablesQuerySchema = z.object({
  page: intParam('page', 1, 100_000, 1),
  pageSize: intParam('pageSize', 1, 200, 50),
  sort: z.enum(RECEIVABLE_SORTS, { error: msg('reports.sortBy', `Sort by one of ${RECEIVABLE_SORTS.join(', ')}.`, { sorts: RECEIVABLE_SORTS.join(', ') }) }).default('dueCents'),
  order: z.enum(['asc', 'desc'], { error: msg('reports.orderAscDesc', 'Order is asc or desc.') }).default('desc'),
  /** Stock number, plate or vehicle, any part of it, any case. */
  q: z.string().trim().max(100, { error: msg('reports.searchForAtMost', 'Search for at most 100 characters.') }).optional(),
  column: z.enum(BOARD_COLUMNS, { error: msg('reports.chooseColumn', `Choose a column among ${BOARD_COLUMNS.join(', ')}.`, { columns: BOARD_COLUMNS.join(', ') }) }).optional(),
  /** Only vehicles on the lot at least this many storage days. */
  minDays: intParam('minDays', 0, 100_000, 0),
})
export type ReceivablesQuery = z.infer<typeof receivablesQuerySchema>

export const receivablesSchema = z.object({
  asOf: z.string(),
  timeZone: z.string(),
  page: z.number().int(),
  pageSize: z.number().int(),
  /** Totals of every row the filters keep, not only this page's. */
  totals: totalsSchema,
  rows: z.array(receivableRowSchema),
})
export type Receivables = z.infer<typeof receivablesSchema>

// ---------------------------------------------------------------- aged inventory

export const AGE_THRESHOLDS = [30, 60, 90] as const

export const agedRowSchema = z.object({
  ...vehicleShape,
  /** Calendar days on the yard's clock from the arrival day to today. */
  days: z.number().int(),
  /** The largest threshold it is over: 30, 60 or 90. */
  over: z.union([z.literal(30), z.literal(60), z.literal(90)]),
  dueCents: z.number().int().nullable(),
  eligible: lienSaleEligibleSchema.nullable(),
  /** When not yet eligible: the gate's code and the day it may open, if known. */
  lienSale: z.object({ code: z.string(), date: z.string().nullable() }).nullable(),
})
export type AgedRow = z.infer<typeof agedRowSchema>

/** Which vehicles the aged list shows (over 30, 60 or 90 days) and which page of them. */
export const agedQuerySchema = z.object({
  over: z.coerce.number().pipe(z.union([z.literal(30), z.literal(60), z.literal(90)], { error: msg('reports.over306090', 'Over is 30, 60 or 90 days.') })).default(30),
  page: intParam('page', 1, 100_000, 1),
  pageSize: intParam('pageSize', 1, 200, 50),
})
export type AgedQuery = z.infer<typeof agedQuerySchema>

export const agedSchema = z.object({
  asOf: z.string(),
  /** The rows over `over` days: `total` of them, this page's in `rows`. */
  over: z.number().int(),
  page: z.number().int(),
  pageSize: z.number().int(),
  total: z.number().int(),
  today: z.string(),
  timeZone: z.string(),
  /** Vehicles on the lot over each threshold (a vehicle over 90 days counts in all three). */
  counts: z.object({ over30: z.number().int(), over60: z.number().int(), over90: z.number().int(), eligible: z.number().int(), onLot: z.number().int() }),
  rows: z.array(agedRowSchema),
})
export type Aged = z.infer<typeof agedSchema>

// ---------------------------------------------------------------- daily report

export const dailyQuerySchema = z.object({
  /** A day of the yard's calendar; today when not given. */
  date: z.iso.date({ error: msg('reports.giveDayAsYyyy', 'Give the day as YYYY-MM-DD.') }).optional(),
  lang: z.enum(['en', 'es'], { error: msg('reports.languageEnEs', 'The language is en or es.') }).default('en'),
})

const movedSchema = z.object({ vehicleId: z.uuid(), stockNumber: z.string(), vehicle: z.string(), plate: z.string().nullable(), at: z.string() })

/** One yard day: who came in and went out, the money by method, the storage it earned, its drawer. */
export const dailyReportSchema = z.object({
  date: z.string(),
  today: z.string(),
  timeZone: z.string(),
  arrivals: z.array(movedSchema.extend({ towReason: z.string().nullable() })),
  releases: z.array(movedSchema.extend({ disposition: z.string().nullable() })),
  /** Payments and refunds of the day by method; net = payments − refunds. */
  payments: z.array(z.object({ method: z.string(), count: z.number().int(), paymentsCents: z.number().int(), refundsCents: z.number().int(), netCents: z.number().int() })),
  paymentsNetCents: z.number().int(),
  /** What the lot's bills (storage, the rule set's fees and their tax) grew by over the day. */
  storageEarnedCents: z.number().int(),
  storageVehicles: z.number().int(),
  closeout: z
    .object({ openingFloatCents: z.number().int(), recordedCents: z.number().int(), expectedCents: z.number().int(), countedCents: z.number().int(), overShortCents: z.number().int(), closedBy: z.string(), closedAt: z.string() })
    .nullable(),
  /** Cash recorded in the drawer that day (whether closed or not). */
  cashRecordedCents: z.number().int(),
})
export type DailyReport = z.infer<typeof dailyReportSchema>

// ---------------------------------------------------------------- monthly salvage inventory (28 CFR 25.56)

/**
 * What Holdfast counts as "obtained as junk or salvage" (28 CFR 25.56): a vehicle that left the board
 * closed as a title transfer (signed over to the yard or a salvage buyer), a lien sale or disposal, or
 * scrapped — the ways a towed vehicle stops being its owner's. The day obtained is the day it closed.
 */
export const SALVAGE_DISPOSITIONS = ['title_transferred', 'lien_sale', 'scrapped'] as const

export const salvageQuerySchema = z.object({
  /** A calendar month of the yard, YYYY-MM; the month before this one when not given (the report is for the prior month). */
  month: z
    .string({ error: msg('reports.giveMonthAsYyyy', 'Give the month as YYYY-MM.') })
    .regex(/^\d{4}-(0[1-9]|1[0-2])$/, { error: msg('reports.giveMonthAsYyyy', 'Give the month as YYYY-MM.') })
    .optional(),
  lang: z.enum(['en', 'es'], { error: msg('reports.languageEnEs', 'The language is en or es.') }).default('en'),
})

export const salvageRowSchema = z.object({
  vehicleId: z.uuid(),
  stockNumber: z.string(),
  vin: z.string().nullable(),
  vehicle: z.string(),
  /** The yard's calendar day it closed. */
  obtainedOn: z.string(),
  /** The registered owner on record, else the owner's name typed at tow-in; null when unknown. */
  fromWhom: z.string().nullable(),
  disposition: z.enum(SALVAGE_DISPOSITIONS),
  /** Crushed (scrapped) or disposed of (sold or transferred). */
  crushed: z.boolean(),
  /** Who collected it at the release, when recorded. */
  toWhom: z.string().nullable(),
  /** Holdfast records no export flag yet: null means "not recorded", never "no". */
  forExport: z.boolean().nullable(),
})
export type SalvageRow = z.infer<typeof salvageRowSchema>

export const salvageSchema = z.object({ month: z.string(), timeZone: z.string(), rows: z.array(salvageRowSchema) })
export type Salvage = z.infer<typeof salvageSchema>
