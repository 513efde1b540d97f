import { z } from 'zod'
import { LOCALES } from '../messages/locales'
import { type FieldWhat, msg, whatWords } from './field-messages'

// Building blocks for the forms' schemas, so every field says the same thing the same way.

const tooLong = (max: number) => msg('common.tooLong', `Keep this under ${max} characters.`, { max })

export const BROKEN_TEXT = msg('common.containsBrokenCharacterLone', 'Contains a broken character (a lone UTF-16 surrogate) that cannot be stored. Retype the text and try again.')

/**
 * Any string that is stored: a lone UTF-16 surrogate ("\ud800" in JSON) is no character at all —
 * PostgreSQL's jsonb refuses it and a text column would keep U+FFFD in its place. `\p{Cs}` with the
 * u flag matches only an unpaired surrogate (String.prototype.isWellFormed, which ES2023 lacks).
 */
export function text(params?: Parameters<typeof z.string>[0]) {
  return z.string(params).refine((v) => !/\p{Cs}/u.test(v), BROKEN_TEXT)
}

/** Trimmed text; an empty field becomes null, so "nothing typed" is stored one way everywhere. */
export function optionalText(max: number) {
  return text()
    .trim()
    .max(max, tooLong(max))
    .nullish()
    .transform((v) => (v ? v : null))
}

export function requiredText(max: number, missing: string) {
  return text({ error: missing }).trim().min(1, missing).max(max, tooLong(max))
}

/** An instant with its offset: a bare local time would be read in the server's own zone. */
export const instantSchema = z.iso.datetime({ offset: true, error: msg('common.enterDateTime', 'Enter a date and time.') })

export const optionalInstant = instantSchema.nullish().transform((v) => v ?? null)

/** A whole number field that may be left empty. */
export function optionalInt(min: number, max: number, what: FieldWhat) {
  const { words, Words } = whatWords(what)
  const most = max.toLocaleString('en-US')
  return z
    .number({ error: msg('common.enterAsNumber', `Enter ${words} as a number.`, { what }) })
    .int(msg('common.enterAsWholeNumber', `Enter ${words} as a whole number.`, { what }))
    .min(min, msg('common.cannotBeBelow', `${Words} cannot be below ${min}.`, { what, min }))
    .max(max, msg('common.cannotBeAbove', `${Words} cannot be above ${most}.`, { what, max: most }))
    .nullish()
    .transform((v) => v ?? null)
}

export const uuidSchema = (message: string) => z.uuid({ error: message })

/**
 * For an object's cross-field checks: run them even when another field is already wrong, so a form
 * shows every problem at once (zod skips them otherwise), but only once the value is an object.
 * Such a check must read its fields defensively: they may not have parsed.
 */
export const alongsideFieldIssues = { when: (payload: { value: unknown }) => typeof payload.value === 'object' && payload.value !== null }

/** The page sizes a long list offers; a list's first page shows the first of them. */
export const PAGE_SIZES = [25, 50, 100] as const

/** `page` and `pageSize` of a paged list's query string (the archive, the outbox). */
export const pagingShape = {
  page: z.coerce.number({ error: msg('common.pageNumber', 'The page is a number.') }).int(msg('common.pageWholeNumber', 'The page is a whole number.')).min(1, msg('common.pagesStartAt1', 'Pages start at 1.')).max(100_000).default(1),
  pageSize: z.coerce
    .number({ error: msg('common.pageSizeNumber', 'The page size is a number.') })
    .int(msg('common.pageSizeWholeNumber', 'The page size is a whole number.'))
    .refine((n) => (PAGE_SIZES as readonly number[]).includes(n), msg('common.pageSizes', `Show ${PAGE_SIZES.join(', ')} a page.`, { sizes: PAGE_SIZES.join(', ') }))
    .default(PAGE_SIZES[0]),
}

/** `?lang=` of a printed document (a receipt, a release form, a letter): the language it is printed in, English unless asked. */
export const documentLanguageQuerySchema = z.object({ lang: z.enum(LOCALES, { error: msg('common.chooseEnOrEs', 'Choose en or es.') }).default('en') })
