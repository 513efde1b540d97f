import { z } from 'zod'
import { DISPOSITIONS } from '../domain/lifecycle/columns'
import { alongsideFieldIssues, optionalText, requiredText, text } from './fields'
import { msg } from './field-messages'

/** Who comes to the counter to collect a vehicle (issue 11, "Release"). */
export const CLAIMANT_KINDS = ['registered_owner', 'owner_agent', 'tow_operator', 'salvage_buyer', 'holding_agency'] as const
export type ClaimantKind = (typeof CLAIMANT_KINDS)[number]

export const ID_TYPES = ['drivers_license', 'state_id', 'passport', 'military_id', 'other'] as const
export type IdType = (typeof ID_TYPES)[number]

/** How each claimant proves they may take it; the clerk records the paper they showed. */
export const AUTHORITY_KINDS = ['title', 'registration', 'written_authorisation', 'bill_of_sale', 'agency_release', 'other'] as const
export type AuthorityKind = (typeof AUTHORITY_KINDS)[number]

/** Those who collect for a released vehicle ("released to a third party") rather than its owner. */
export const THIRD_PARTY_CLAIMANTS: readonly ClaimantKind[] = ['owner_agent', 'tow_operator', 'salvage_buyer', 'holding_agency']

/** The way out a claimant's release closes the vehicle by. */
export const dispositionFor = (kind: ClaimantKind) => (kind === 'registered_owner' ? 'returned_to_owner' : 'released_to_third_party')

const ISO_DAY = /^\d{4}-\d{2}-\d{2}$/

/** Today's calendar day in a time zone, as "2026-12-02" (the ID's expiry is a calendar day). */
export function dayIn(timeZone: string, at = new Date()): string {
  return new Intl.DateTimeFormat('en-CA', { timeZone, year: 'numeric', month: '2-digit', day: '2-digit' }).format(at)
}

export const claimantInputSchema = z
  .object({
    kind: z.enum(CLAIMANT_KINDS, { error: msg('releases.chooseWhoCollectingVehicle', 'Choose who is collecting the vehicle.') }),
    name: requiredText(120, msg('releases.enterFullNamePerson', 'Enter the full name of the person collecting, as on their ID.')),
    /** For an agent, operator, buyer or agency: whom they act for or represent. */
    actingFor: optionalText(160),
    idType: z.enum(ID_TYPES, { error: msg('releases.chooseKindIdShown', 'Choose the kind of ID shown.') }),
    idNumber: requiredText(40, msg('releases.enterIdNumber', 'Enter the ID number.')),
    idIssuer: requiredText(80, msg('releases.enterWhoIssuedId', 'Enter who issued the ID (a state, a country, an agency).')),
    idExpiry: text({ error: msg('releases.enterDateIdExpires', 'Enter the date the ID expires.') }).regex(ISO_DAY, msg('releases.enterDateIdExpires', 'Enter the date the ID expires.')),
    authorityKind: z.enum(AUTHORITY_KINDS, { error: msg('releases.chooseProofOwnershipAuthority', 'Choose the proof of ownership or authority shown.') }),
    authorityReference: requiredText(120, msg('releases.enterProofNumberShort', 'Enter the proof’s number or a short description (title number, letter date and signer).')),
  })
  .superRefine((c, ctx) => {
    if (c.kind && c.kind !== 'registered_owner' && !c.actingFor) {
      ctx.addIssue({ code: 'custom', path: ['actingFor'], message: msg('releases.nameWhomTheyCollect', 'Name whom they collect for: the owner, the company or the agency.') })
    }
    if (c.kind === 'owner_agent' && c.authorityKind && c.authorityKind !== 'written_authorisation') {
      ctx.addIssue({ code: 'custom', path: ['authorityKind'], message: msg('releases.agentNeedsOwnerWritten', "An agent needs the owner's written authorisation.") })
    }
    if (c.kind === 'holding_agency' && c.authorityKind && c.authorityKind !== 'agency_release') {
      ctx.addIssue({ code: 'custom', path: ['authorityKind'], message: msg('releases.holdingAgencyReleaseProof', "The holding agency's release is the proof for an agency.") })
    }
  }, alongsideFieldIssues)
export type ClaimantInput = z.input<typeof claimantInputSchema>
export type Claimant = z.output<typeof claimantInputSchema>

export const propertyReturnSchema = z.object({
  itemId: z.uuid({ error: msg('releases.thatNotItemInventory', 'That is not an item of the inventory.') }),
  returned: z.boolean({ error: msg('releases.sayWhetherThisItem', 'Say whether this item was handed back.') }),
  note: optionalText(200),
})

export const handoverInputSchema = z.object({
  odometer: z
    .number({ error: msg('releases.enterOdometerReadingMark', 'Enter the odometer reading, or mark it unreadable.') })
    .int(msg('releases.enterOdometerAsWhole', 'Enter the odometer as a whole number.'))
    .min(0, msg('releases.odometerCannotBelow0', 'The odometer cannot be below 0.'))
    .max(2_000_000, msg('releases.odometerCannotAbove2', 'The odometer cannot be above 2,000,000.'))
    .nullable(),
  odometerUnreadable: z.boolean().default(false),
  property: z.array(propertyReturnSchema).max(200),
}).superRefine((h, ctx) => {
  if (h.odometer === null && !h.odometerUnreadable) {
    ctx.addIssue({ code: 'custom', path: ['odometer'], message: msg('releases.enterOdometerReadingMark', 'Enter the odometer reading, or mark it unreadable.') })
  }
}, alongsideFieldIssues)
export type HandoverInput = z.input<typeof handoverInputSchema>

/** A PNG data URL from the signature pad; the server checks it is an image with ink on it. */
export const SIGNATURE_PREFIX = 'data:image/png;base64,'
export const MAX_SIGNATURE_CHARS = 700_000

export const signatureInputSchema = z.object({
  signerName: requiredText(120, msg('releases.enterNamePersonSigning', 'Enter the name of the person signing.')),
  image: text({ error: msg('releases.signBoxFirst', 'Sign in the box first.') })
    .max(MAX_SIGNATURE_CHARS, msg('releases.signatureImageTooLarge', 'The signature image is too large.'))
    .refine((v) => v.startsWith(SIGNATURE_PREFIX) && v.length > SIGNATURE_PREFIX.length, msg('releases.signBoxFirst', 'Sign in the box first.')),
})
export type SignatureInput = z.infer<typeof signatureInputSchema>

/** What a gate types or a scanner reads: the pass's token, its link, or its short code. */
export const gatePassKeySchema = z.object({
  pass: requiredText(300, msg('releases.scanPassTypeIts', 'Scan the pass or type its code.')),
})
export type GatePassKey = z.infer<typeof gatePassKeySchema>

// The short code printed on the pass: the owner link's alphabet (no 0/O, 1/I/L), 10 characters.
export const GATE_CODE_ALPHABET = '23456789ABCDEFGHJKMNPQRSTUVWXYZ'
export const GATE_CODE_LENGTH = 10
export const normalizeGateCode = (value: string) => value.toUpperCase().replace(/[\s-]/g, '')
export const formatGateCode = (code: string) => `${code.slice(0, 5)}-${code.slice(5)}`

const claimantRecordSchema = z.object({
  kind: z.enum(CLAIMANT_KINDS),
  name: z.string(),
  actingFor: z.string().nullable(),
  idType: z.enum(ID_TYPES),
  idNumber: z.string(),
  idIssuer: z.string(),
  idExpiry: z.string(),
  authorityKind: z.enum(AUTHORITY_KINDS),
  authorityReference: z.string(),
})

export const releaseRecordSchema = z.object({
  id: z.uuid(),
  claimant: claimantRecordSchema.nullable(),
  idPhoto: z.object({ id: z.uuid(), url: z.string(), thumbUrl: z.string().nullable() }).nullable(),
  odometer: z.number().nullable(),
  odometerUnreadable: z.boolean(),
  handoverRecordedAt: z.string().nullable(),
  photos: z.array(z.object({ id: z.uuid(), url: z.string(), thumbUrl: z.string().nullable() })),
  signature: z.object({ signerName: z.string(), signedAt: z.string(), url: z.string() }).nullable(),
})
export type ReleaseRecord = z.infer<typeof releaseRecordSchema>

export const releaseStepSchema = z.object({
  code: z.enum(['hold', 'balance', 'claimant', 'id-photo', 'handover', 'signature']),
  done: z.boolean(),
  message: z.string().nullable(),
  /** Why a step is not done, each with its words' key under `refusals.reasons` (the message is their English). */
  reasons: z.array(z.object({ message: z.string(), key: z.string().optional(), params: z.record(z.string(), z.union([z.string(), z.number()])).optional() })).default([]),
})

export const releasePageSchema = z.object({
  vehicleId: z.uuid(),
  state: z.string(),
  version: z.number(),
  today: z.string(),
  release: releaseRecordSchema.nullable(),
  property: z.array(
    z.object({ id: z.uuid(), item: z.string(), location: z.string().nullable(), count: z.number(), returned: z.boolean().nullable(), note: z.string().nullable() }),
  ),
  /** What still stands between this vehicle and the gate, in order; the reasons are the lifecycle's. */
  steps: z.array(releaseStepSchema),
  /** The way out this release closes by, once a claimant is recorded. */
  disposition: z.enum(DISPOSITIONS).nullable(),
  /** Why a gate pass cannot be issued yet (the closing move's reasons), empty when it can. */
  gateReasons: z.array(z.object({ code: z.string(), message: z.string(), key: z.string().optional(), params: z.record(z.string(), z.union([z.string(), z.number()])).optional() })),
  gatePass: z.object({ id: z.uuid(), issuedAt: z.string(), expiresAt: z.string(), usedAt: z.string().nullable() }).nullable(),
})
export type ReleasePage = z.infer<typeof releasePageSchema>

export const gatePassIssuedSchema = z.object({
  id: z.uuid(),
  code: z.string(),
  expiresAt: z.string(),
  /** The pass itself, to print: a PDF as base64 (its token is in the QR and nowhere else). */
  pdf: z.string(),
})
export type GatePassIssued = z.infer<typeof gatePassIssuedSchema>

export const gateVehicleSchema = z.object({
  passId: z.uuid(),
  vehicleId: z.uuid(),
  stockNumber: z.string(),
  year: z.number().nullable(),
  make: z.string().nullable(),
  model: z.string().nullable(),
  colour: z.string().nullable(),
  plate: z.string().nullable(),
  plateState: z.string().nullable(),
  space: z.string().nullable(),
  photoUrl: z.string().nullable(),
  disposition: z.enum(DISPOSITIONS),
  claimantName: z.string().nullable(),
  expiresAt: z.string(),
})
export type GateVehicle = z.infer<typeof gateVehicleSchema>

export const gateRecordedSchema = z.object({ vehicleId: z.uuid(), stockNumber: z.string(), state: z.literal('closed'), disposition: z.enum(DISPOSITIONS), at: z.string() })
export type GateRecorded = z.infer<typeof gateRecordedSchema>
