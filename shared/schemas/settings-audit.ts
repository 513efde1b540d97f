import { z } from 'zod'
import { pagingShape } from './fields'

/** The settings the audit covers; yards and staff join rule sets later. */
export const SETTINGS_AREAS = ['rule-set', 'yard', 'staff'] as const
export type SettingsArea = (typeof SETTINGS_AREAS)[number]

export const SETTINGS_ACTIONS = ['copied', 'saved', 'rule-set-chosen', 'yard-added', 'yard-edited', 'spaces-added', 'space-retired', 'staff-yards'] as const
export type SettingsAction = (typeof SETTINGS_ACTIONS)[number]

export const settingsChangeSchema = z.object({
  id: z.uuid(),
  at: z.string(),
  actor: z.string().nullable(),
  area: z.enum(SETTINGS_AREAS),
  action: z.enum(SETTINGS_ACTIONS),
  subjectId: z.string(),
  subjectLabel: z.string(),
  before: z.record(z.string(), z.unknown()).nullable(),
  after: z.record(z.string(), z.unknown()).nullable(),
  /** How a person names the list items the paths point into: "vehicleClasses.0" → "Car". */
  names: z.record(z.string(), z.string()),
  reason: z.string().nullable(),
})
export type SettingsChange = z.infer<typeof settingsChangeSchema>

export const settingsAuditQuerySchema = z.object({ ...pagingShape })
export type SettingsAuditQuery = z.input<typeof settingsAuditQuerySchema>

export const settingsAuditPageSchema = z.object({ changes: z.array(settingsChangeSchema), total: z.number().int() })
export type SettingsAuditPage = z.infer<typeof settingsAuditPageSchema>
