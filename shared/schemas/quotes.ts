import { z } from 'zod'
import { clockEventKindSchema } from './rule-sets'
import { msg } from './field-messages'

/** An instant with its offset: a bare local time would be read in the server's zone. */
export const instantSchema = z.iso.datetime({ offset: true })

const code = z.string().regex(/^[a-z0-9]+(-[a-z0-9]+)*$/, msg('ruleSets.codeWords', 'use lower-case words joined by dashes'))

export const feeEventSchema = z.object({ fee: code, at: instantSchema })

export const staySchema = z.object({
  arrivedAt: instantSchema,
  releasedAt: instantSchema.nullish(),
  vehicleClass: code,
  feeEvents: z.array(feeEventSchema).max(500).default([]),
})

export const storageQuoteRequestSchema = z.object({
  ruleSetId: code,
  stay: staySchema,
  asOf: instantSchema,
  /** The yard's zone when it differs from the rule set's default. */
  timeZone: z.string().min(1).max(64, msg('quotes.timeZoneNameAt', 'A time zone name is at most 64 characters, like America/Los_Angeles.')).optional(),
})

export const clockVehicleSchema = z.object({
  modelYear: z.number().int().min(1900).max(2200).nullish(),
  valueCents: z.number().int().nonnegative().nullish(),
})

export const clockEventSchema = z.object({ kind: clockEventKindSchema, at: instantSchema })

export const legalClocksRequestSchema = z.object({
  ruleSetId: code,
  vehicle: clockVehicleSchema,
  events: z.array(clockEventSchema).max(500),
  asOf: instantSchema,
  timeZone: z.string().min(1).max(64, msg('quotes.timeZoneNameAt', 'A time zone name is at most 64 characters, like America/Los_Angeles.')).optional(),
})

export type Stay = z.infer<typeof staySchema>
export type StorageQuoteRequest = z.infer<typeof storageQuoteRequestSchema>
export type LegalClocksRequest = z.infer<typeof legalClocksRequestSchema>
