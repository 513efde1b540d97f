import { z } from 'zod'
import { alongsideFieldIssues, optionalText, requiredText } from './fields'
import { msg } from './field-messages'
import { spanishWordsSchema } from './rule-sets'

/** Who may have to be told about a vehicle: the registered owner, each legal owner or lienholder, the insurer, anyone else with an interest. */
export const CONTACT_ROLES = ['registered_owner', 'lienholder', 'insurer', 'interested_party'] as const
export type ContactRole = (typeof CONTACT_ROLES)[number]

/** Where the office found the record. */
export const CONTACT_SOURCES = ['records_request', 'vehicle_papers', 'counter', 'other'] as const
export type ContactSource = (typeof CONTACT_SOURCES)[number]

/** The languages letters and e-mails go out in. */
export const CONTACT_LANGUAGES = ['en', 'es'] as const
export type ContactLanguage = (typeof CONTACT_LANGUAGES)[number]

/** A calendar day on the yard's calendar, "2026-12-02". */
export const isoDaySchema = (missing: string) => z.iso.date({ error: missing })

/** US state or territory code, two letters. */
const stateCode = z
  .string()
  .trim()
  .toUpperCase()
  .regex(/^[A-Z]{2}$/, msg('contacts.enterTwoLetterState', 'Enter the two-letter state code, e.g. CA.'))
  .nullish()
  .or(z.literal('').transform(() => null))
  .transform((v) => v ?? null)

const zip = z
  .string()
  .trim()
  .regex(/^\d{5}(-\d{4})?$/, msg('contacts.enter5DigitZip', 'Enter a 5-digit ZIP code (or ZIP+4).'))
  .nullish()
  .or(z.literal('').transform(() => null))
  .transform((v) => v ?? null)

const email = z
  .string()
  .trim()
  .max(254, msg('contacts.keepThisUnder254', 'Keep this under 254 characters.'))
  .pipe(z.email({ error: msg('common.thatNotMailAddress', 'That is not an e-mail address.') }))
  .nullish()
  .or(z.literal('').transform(() => null))
  .transform((v) => v ?? null)

const phone = optionalText(40).refine((v) => v === null || /^[0-9+().\-\s]{7,40}$/.test(v), msg('contacts.enterPhoneNumberWith', 'Enter a phone number with digits, e.g. (559) 555-0142.'))

export const contactInputSchema = z
  .object({
    role: z.enum(CONTACT_ROLES, { error: msg('contacts.chooseWhoThisOwner', 'Choose who this is: owner, lienholder, insurer or other.') }),
    name: requiredText(200, msg('contacts.enterName', 'Enter the name.')),
    street: optionalText(200),
    city: optionalText(100),
    state: stateCode,
    zip,
    phone,
    email,
    language: z.enum(CONTACT_LANGUAGES, { error: msg('common.chooseEnglishSpanish', 'Choose English or Spanish.') }).default('en'),
    source: z.enum(CONTACT_SOURCES, { error: msg('contacts.chooseWhereRecordCame', 'Choose where the record came from.') }),
    /** The day of the state records request the record came from. */
    sourceDate: isoDaySchema(msg('contacts.enterDateRecordsRequest', 'Enter the date of the records request.')).nullish().or(z.literal('').transform(() => null)).transform((v) => v ?? null),
    sourceNote: optionalText(300),
  })
  .superRefine((c, ctx) => {
    // A postal address is all or nothing: a letter cannot go to half of one.
    const parts = [['street', c.street], ['city', c.city], ['state', c.state], ['zip', c.zip]] as const
    const given = parts.filter(([, v]) => v)
    if (given.length > 0 && given.length < parts.length) {
      for (const [path, v] of parts) {
        if (!v) ctx.addIssue({ code: 'custom', path: [path], message: msg('contacts.completePostalAddressStreet', 'Complete the postal address: street, city, state and ZIP.') })
      }
    }
    if (c.source === 'records_request' && !c.sourceDate) {
      ctx.addIssue({ code: 'custom', path: ['sourceDate'], message: msg('contacts.enterDateRecordsRequest', 'Enter the date of the records request.') })
    }
    if (c.source === 'other' && !c.sourceNote) ctx.addIssue({ code: 'custom', path: ['sourceNote'], message: msg('contacts.sayWhereRecordCame', 'Say where the record came from.') })
  }, alongsideFieldIssues)
export type ContactInput = z.input<typeof contactInputSchema>
export type Contact = z.output<typeof contactInputSchema>

export const contactRecordSchema = z.object({
  id: z.uuid(),
  role: z.enum(CONTACT_ROLES),
  name: z.string(),
  street: z.string().nullable(),
  city: z.string().nullable(),
  state: z.string().nullable(),
  zip: z.string().nullable(),
  phone: z.string().nullable(),
  email: z.string().nullable(),
  language: z.enum(CONTACT_LANGUAGES),
  source: z.enum(CONTACT_SOURCES),
  sourceDate: z.string().nullable(),
  sourceNote: z.string().nullable(),
  createdAt: z.string(),
  updatedAt: z.string(),
})
export type ContactRecord = z.infer<typeof contactRecordSchema>

/** The one-line postal address of a contact, or null when it has none. */
export function postalAddress(c: Pick<ContactRecord, 'street' | 'city' | 'state' | 'zip'>): string | null {
  if (!c.street || !c.city || !c.state || !c.zip) return null
  return `${c.street}, ${c.city}, ${c.state} ${c.zip}`
}

export const contactParamsSchema = z.object({
  vehicleId: z.uuid({ error: msg('common.thatNotVehicleId', 'That is not a vehicle id.') }),
  contactId: z.uuid({ error: msg('common.thatNotContactId', 'That is not a contact id.') }),
})

/** The outcome of a state records request: the records named someone, or there was no record. */
export const RECORDS_OUTCOMES = ['found', 'no_record'] as const
export type RecordsOutcome = (typeof RECORDS_OUTCOMES)[number]

/**
 * A records request: the day it was sent (the clock event that meets the rule set's "request the
 * records" deadline), and once answered, the day and whether a record was found.
 */
export const recordsRequestInputSchema = z
  .object({
    agency: optionalText(120),
    sentOn: isoDaySchema(msg('contacts.enterDayRequestWas', 'Enter the day the request was sent.')),
    answeredOn: isoDaySchema(msg('contacts.enterDayAnswerCame', 'Enter the day the answer came.')).nullish().or(z.literal('').transform(() => null)).transform((v) => v ?? null),
    outcome: z.enum(RECORDS_OUTCOMES, { error: msg('contacts.chooseWhetherRecordWas', 'Choose whether a record was found.') }).nullish().transform((v) => v ?? null),
  })
  .superRefine((r, ctx) => {
    if (r.answeredOn && !r.outcome) ctx.addIssue({ code: 'custom', path: ['outcome'], message: msg('contacts.chooseWhetherRecordWas', 'Choose whether a record was found.') })
    if (r.outcome && !r.answeredOn) ctx.addIssue({ code: 'custom', path: ['answeredOn'], message: msg('contacts.enterDayAnswerCame', 'Enter the day the answer came.') })
    if (typeof r.answeredOn === 'string' && typeof r.sentOn === 'string' && r.answeredOn < r.sentOn) {
      ctx.addIssue({ code: 'custom', path: ['answeredOn'], message: msg('contacts.answerCannotComeBefore', 'The answer cannot come before the request was sent.') })
    }
  }, alongsideFieldIssues)
export type RecordsRequestInput = z.input<typeof recordsRequestInputSchema>
export type RecordsRequest = z.output<typeof recordsRequestInputSchema>

/** Answering a request already recorded. */
export const recordsAnswerSchema = z.object({
  answeredOn: isoDaySchema(msg('contacts.enterDayAnswerCame', 'Enter the day the answer came.')),
  outcome: z.enum(RECORDS_OUTCOMES, { error: msg('contacts.chooseWhetherRecordWas', 'Choose whether a record was found.') }),
})
export type RecordsAnswer = z.infer<typeof recordsAnswerSchema>

export const recordsRequestRecordSchema = z.object({
  id: z.uuid(),
  agency: z.string().nullable(),
  sentOn: z.string(),
  answeredOn: z.string().nullable(),
  outcome: z.enum(RECORDS_OUTCOMES).nullable(),
  recordedBy: z.string().nullable(),
})
export type RecordsRequestRecord = z.infer<typeof recordsRequestRecordSchema>

export const recordsParamsSchema = z.object({
  vehicleId: z.uuid({ error: msg('common.thatNotVehicleId', 'That is not a vehicle id.') }),
  requestId: z.uuid({ error: msg('contacts.thatNotRecordsRequest', 'That is not a records request id.') }),
})

/** The rule set's deadline to request the owner records, as the "Who to tell" section shows it. */
export const recordsDeadlineSchema = z.object({
  label: z.string(),
  status: z.enum(['upcoming', 'met', 'missed', 'reached', 'not-started', 'needs-information']),
  dueDate: z.string().nullable(),
  doneAt: z.string().nullable(),
  citation: z.string(),
  es: spanishWordsSchema.optional(),
})
export type RecordsDeadline = z.infer<typeof recordsDeadlineSchema>

export const contactsPageSchema = z.object({
  contacts: z.array(contactRecordSchema),
  recordsRequests: z.array(recordsRequestRecordSchema),
  /** Null when the rule set sets no such deadline for this vehicle. */
  recordsDeadline: recordsDeadlineSchema.nullable(),
})
export type ContactsPage = z.infer<typeof contactsPageSchema>
