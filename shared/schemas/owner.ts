import { z } from 'zod'
import { clockExplanationSchema } from './clock-explanations'
import { FINDING_STATUSES } from '../domain/inspection/inspection-checklist'
import { VEHICLE_STATES } from '../domain/lifecycle/columns'
import { optionalText, requiredText, text } from './fields'
import { msg } from './field-messages'
import { spanishWordsSchema } from './rule-sets'

// The owner's page (no account): the link the office creates, what the page shows, the owner's choice.

/** What an owner may choose on their page. Paying and signing arrive with the release work (issue 11). */
export const OWNER_CHOICES = ['repair', 'collect', 'sign_over', 'call'] as const
export type OwnerChoice = (typeof OWNER_CHOICES)[number]

/** Whom a vehicle is signed over to. */
export const SIGN_OVER_TO = ['yard', 'salvage_buyer'] as const
export type SignOverTo = (typeof SIGN_OVER_TO)[number]

/**
 * The short code's alphabet: digits and capitals without 0/O, 1/I/L — nothing a person misreads
 * from a printed letter. Ten of them: 31^10 ≈ 8 × 10^14 codes, guessed only through the rate limit.
 */
export const CODE_ALPHABET = '23456789ABCDEFGHJKMNPQRSTUVWXYZ'
export const CODE_LENGTH = 10

/** A code as typed: case, spaces and dashes do not matter. */
export function normalizeCode(typed: string): string {
  return typed.toUpperCase().replace(/[\s-]/g, '')
}
export const isCode = (key: string) => key.length === CODE_LENGTH && [...key].every((c) => CODE_ALPHABET.includes(c))
/** The code as printed: two groups of five. */
export const formatCode = (code: string) => `${code.slice(0, 5)}-${code.slice(5)}`

/** The page's key in its address: the link's token (43 characters) or a short code. */
export const ownerKeyParamsSchema = z.object({ key: z.string().min(1).max(64) })
export const ownerFileParamsSchema = ownerKeyParamsSchema.extend({ fileId: z.uuid({ error: msg('owner.thatNotFileId', 'That is not a file id.') }) })

export const codeInputSchema = z.object({
  code: text({ error: msg('owner.typeCodeFromYour', 'Type the code from your letter.') })
    .transform(normalizeCode)
    .refine(isCode, msg('owner.codeHas', `The code has ${CODE_LENGTH} letters and digits, like ABCDE-23456.`, { n: CODE_LENGTH })),
})
export type CodeInput = z.input<typeof codeInputSchema>

// ---- the office's side ----

export const ownerLinkRecordSchema = z.object({
  id: z.uuid(),
  createdAt: z.string(),
  createdBy: z.string(),
  expiresAt: z.string(),
  revokedAt: z.string().nullable(),
  revokedBy: z.string().nullable(),
  status: z.enum(['active', 'expired', 'revoked']),
})
export type OwnerLinkRecord = z.infer<typeof ownerLinkRecordSchema>

export const ownerDecisionRecordSchema = z.object({
  id: z.uuid(),
  choice: z.enum(OWNER_CHOICES),
  signOverTo: z.enum(SIGN_OVER_TO).nullable(),
  fullName: z.string(),
  phone: z.string().nullable(),
  note: z.string().nullable(),
  ip: z.string(),
  at: z.string(),
})
export type OwnerDecisionRecord = z.infer<typeof ownerDecisionRecordSchema>

/** GET /api/vehicles/:vehicleId/owner-links: the links given out and what the owner chose. */
export const vehicleOwnerSchema = z.object({
  links: z.array(ownerLinkRecordSchema),
  decisions: z.array(ownerDecisionRecordSchema),
})
export type VehicleOwner = z.infer<typeof vehicleOwnerSchema>

/** The one answer that carries the token and the code: shown once, never stored in the clear. */
export const ownerLinkCreatedSchema = z.object({
  link: ownerLinkRecordSchema,
  token: z.string(),
  code: z.string(),
  /** The page's path on this server (`/o/<token>`); the client makes it absolute. */
  path: z.string(),
})
export type OwnerLinkCreated = z.infer<typeof ownerLinkCreatedSchema>

// ---- the owner's side ----

export const ownerDecisionInputSchema = z
  .object({
    choice: z.enum(OWNER_CHOICES, { error: msg('owner.chooseWhatShouldHappen', 'Choose what should happen to the vehicle.') }),
    signOverTo: z.enum(SIGN_OVER_TO).nullish().transform((v) => v ?? null),
    fullName: requiredText(120, msg('owner.typeYourFullName', 'Type your full name.')),
    phone: optionalText(40),
    note: optionalText(500),
  })
  .superRefine((d, ctx) => {
    if (d.choice === 'sign_over' && !d.signOverTo) ctx.addIssue({ code: 'custom', path: ['signOverTo'], message: msg('owner.sayWhomYouSign', 'Say whom you sign it over to.') })
    if (d.choice === 'call' && !d.phone) ctx.addIssue({ code: 'custom', path: ['phone'], message: msg('owner.giveNumberCallYou', 'Give a number to call you on.') })
  })
export type OwnerDecisionInput = z.input<typeof ownerDecisionInputSchema>

const isoDay = z.iso.date({ error: msg('owner.chooseDate', 'Choose a date.') })
export const ownerQuoteQuerySchema = z.object({ date: isoDay })

/** What the stay costs if the vehicle is collected on a date (any time that day). */
export const ownerQuoteSchema = z.object({
  date: z.string(),
  daysOnLot: z.number(),
  storageCents: z.number(),
  towCents: z.number(),
  balanceCents: z.number(),
})
export type OwnerQuote = z.infer<typeof ownerQuoteSchema>

const photoSchema = z.object({ id: z.uuid(), stage: z.enum(['intake', 'inspection']), label: z.string().nullable(), url: z.string(), thumbUrl: z.string().nullable() })

export const ownerDeadlineSchema = z.object({
  code: z.string(),
  label: z.string(),
  kind: z.enum(['deadline', 'earliest']),
  /** The event that answers it: the page says what it means for the owner by this. */
  doneBy: z.string(),
  status: z.enum(['upcoming', 'met', 'missed', 'reached', 'not-started', 'needs-information']),
  dueDate: z.string().nullable(),
  explanation: z.string(),
  /** The explanation as data, worded in the reader's language (`explanation` is the English). */
  explained: clockExplanationSchema.optional(),
  citation: z.string(),
  /** Its words in Spanish, where the rule set has them (shared/messages/rule-words.ts picks the reader's). */
  es: spanishWordsSchema.optional(),
})
export type OwnerDeadline = z.infer<typeof ownerDeadlineSchema>

/** The release as the owner's page sees it: sign here, or what the counter must record first. */
export const ownerReleaseSchema = z.object({
  status: z.enum(['not-ready', 'at-counter', 'ready', 'signed']),
  /** What the counter still records before the owner may sign here. */
  missing: z.array(z.enum(['claimant', 'id-photo', 'handover'])),
  signerName: z.string().nullable(),
  signedAt: z.string().nullable(),
})
export type OwnerRelease = z.infer<typeof ownerReleaseSchema>

export const ownerPageSchema = z.object({
  vehicle: z.object({
    stockNumber: z.string(),
    year: z.number().nullable(),
    make: z.string().nullable(),
    model: z.string().nullable(),
    colour: z.string().nullable(),
    plate: z.string().nullable(),
    plateState: z.string().nullable(),
    state: z.enum(VEHICLE_STATES),
    arrivedAt: z.string(),
  }),
  yard: z.object({
    name: z.string(),
    address: z.string(),
    phone: z.string().nullable(),
    hours: z.string().nullable(),
    timeZone: z.string(),
    lat: z.number(),
    lng: z.number(),
    /** Today on the yard's calendar: the first date the cost picker offers. */
    today: z.string(),
  }),
  map: z.object({ tileUrl: z.string(), tileAttribution: z.string(), maxZoom: z.number() }),
  photos: z.array(photoSchema),
  inspection: z
    .object({
      finished: z.boolean(),
      findings: z.array(z.object({ code: z.string(), label: z.string(), status: z.enum(FINDING_STATUSES), note: z.string().nullable() })),
      lines: z.array(z.object({ part: z.string(), quantity: z.number(), totalCents: z.number() })),
      totalCents: z.number(),
    })
    .nullable(),
  recommendation: z
    .object({
      recommendation: z.enum(['repair', 'salvage']),
      rule: z.enum(['percent-of-value', 'total-loss-formula']),
      percent: z.number().nullable(),
      estimateCents: z.number(),
      actualCashValueCents: z.number(),
      salvageValueCents: z.number(),
      thresholdCents: z.number(),
      citation: z.string(),
    })
    .nullable(),
  bill: ownerQuoteSchema.nullable(),
  /** What was paid and what is still due, by the counter's own invoice (payments and approved waivers subtracted). */
  money: z
    .object({
      totalCents: z.number(),
      paidCents: z.number(),
      creditedCents: z.number(),
      dueCents: z.number(),
      /** The vehicle is still here and something is due: the owner may pay it by card. */
      canPayByCard: z.boolean(),
    })
    .nullable()
    .default(null),
  /** Signing the release from this page (issue 11). */
  release: ownerReleaseSchema.nullable().default(null),
  deadlines: z.array(ownerDeadlineSchema),
  caution: z.string().nullable(),
  /** The rule set's caution in Spanish, where it has one. */
  es: z.object({ caution: z.string().optional() }).optional(),
  decision: ownerDecisionRecordSchema.omit({ ip: true, id: true }).nullable(),
  expiresAt: z.string(),
})
export type OwnerPage = z.infer<typeof ownerPageSchema>

// ---- "Is my vehicle here?" ----

export const lookupInputSchema = z.object({
  plate: requiredText(12, msg('owner.typePlate', 'Type the plate.')).transform((p) => p.toUpperCase().replace(/[\s-]/g, '')),
  vinTail: text({ error: msg('owner.typeLastCharactersVin', 'Type the last characters of the VIN.') })
    .trim()
    .toUpperCase()
    .regex(/^[A-HJ-NPR-Z0-9]{4,6}$/, msg('owner.typeLast46', 'Type the last 4 to 6 characters of the VIN (no I, O or Q).')),
})
export type LookupInput = z.input<typeof lookupInputSchema>

/** Only whether this yard holds it, where to come, what is owed: nothing else. */
export const lookupAnswerSchema = z.discriminatedUnion('found', [
  z.object({ found: z.literal(false) }),
  z.object({
    found: z.literal(true),
    yard: z.object({ name: z.string(), address: z.string(), phone: z.string().nullable(), hours: z.string().nullable() }),
    balanceCents: z.number().nullable(),
    asOf: z.string(),
  }),
])
export type LookupAnswer = z.infer<typeof lookupAnswerSchema>
