import type english from '../messages/en/fields.json'

// A schema's message in the reader's language (issue 14). Each message is written where the schema
// says it, in English, beside its code: a key under `fields` in shared/messages/<locale>/fields.json.
// zod keeps only a message's text on an issue, so the text leads back to its code here: the server's
// 400 answer carries `code` and `params` beside `message`, and the client shows `t('fields.' + code)`.
// A parameter named `what` is itself a key of `fields.what` (the thing a shared helper is about);
// every other parameter is shown as given.

type Catalog = (typeof english)['fields']
/** A message's code: `<group>.<key>` of the English catalog (`what` holds words for parameters, not messages). */
export type FieldCode = { [G in Exclude<keyof Catalog, 'what'>]: `${G}.${keyof Catalog[G] & string}` }[Exclude<keyof Catalog, 'what'>]
export type FieldWhat = keyof Catalog['what']
export type FieldParams = Record<string, string | number>

export interface FieldWords {
  code: FieldCode
  params?: FieldParams
}

// Written once per message when a schema is built, again for a message made while parsing (a cross-field
// check's): a parameter taken from the input could make many, so the map stops growing at a bound far above
// the ~250 messages the schemas have; a message past it keeps its English only.
const MAX_KNOWN = 5_000
const known = new Map<string, FieldWords>()

/** The English `text` of a schema message, remembered with its code and parameters. */
export function msg(code: FieldCode, text: string, params?: FieldParams): string {
  if (!known.has(text) && known.size < MAX_KNOWN) known.set(text, params ? { code, params } : { code })
  return text
}

/** The code and parameters of a schema message, or nothing for a message no schema wrote (zod's own). */
export function fieldWordsOf(message: string): FieldWords | undefined {
  return known.get(message)
}

/** Every message the schemas have written so far, with its code and parameters (the catalog checks read them). */
export function knownFieldMessages(): [string, FieldWords][] {
  return [...known.entries()]
}

/** An issue as the API answers it: its path, its English message and, when a schema wrote it, its code and parameters. */
export function withFieldWords<T extends { message: string }>(issue: T): T & Partial<FieldWords> {
  const words = fieldWordsOf(issue.message)
  return words ? { ...issue, ...words } : issue
}

/**
 * The things a shared helper's messages are about (`optionalInt(…, 'year')` → "Enter the year as a number."),
 * and the file types an upload accepts ("Use {what}."), each with its article: the English here, every language's under `fields.what` (a test keeps the two equal).
 */
export const FIELD_WHAT = {
  year: 'the year',
  odometer: 'the odometer reading',
  amount: 'the amount',
  refund: 'the refund',
  partPrice: 'the part price',
  vehicleValue: "the vehicle's value",
  salvageValue: 'the salvage value',
  value: 'the value',
  labourRate: 'the labour rate',
  rolls: 'does it roll?',
  steers: 'does it steer?',
  brakes: 'does it brake?',
  keys: 'are the keys here?',
  wheelRefitted: 'was a wheel refitted to make it roll?',
  photoTypes: 'JPEG, PNG, WebP or HEIC photos',
  imageOrPdfTypes: 'JPEG, PNG, WebP or HEIC images or PDF files',
  recordsRequestDate: 'the records request date',
  requestSentOn: 'the day the request was sent',
  answerCameOn: 'the day the answer came',
  mailedOn: 'the mailing day',
  cameBackOn: 'the day it came back',
} as const satisfies Record<FieldWhat, string>

/** The English words of a `what`, and the same with a capital for the start of a sentence. */
export function whatWords(what: FieldWhat): { words: string; Words: string } {
  const words = FIELD_WHAT[what]
  return { words, Words: `${words[0]!.toUpperCase()}${words.slice(1)}` }
}
