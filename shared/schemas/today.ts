import { z } from 'zod'
import { ROLES } from '../domain/access/roles'
import { NOTICE_KINDS } from './notices'

/**
 * What one line of the Today page is about. Each names the vehicle and the part of its page where the
 * work is done (`TODAY_ANCHORS`). Which a role sees is `TODAY_KINDS_BY_ROLE`.
 */
export const TODAY_KINDS = [
  'notice',
  'records-request',
  'deadline',
  'police-notice',
  'inspection',
  'decision',
  'release',
  'lien-sale',
  'hold-ending',
  'no-space',
  'no-photos',
] as const
export type TodayKind = (typeof TODAY_KINDS)[number]

export const TODAY_KINDS_BY_ROLE: Record<(typeof ROLES)[number], readonly TodayKind[]> = {
  office: ['notice', 'records-request', 'deadline', 'decision', 'release', 'lien-sale', 'hold-ending'],
  manager: ['notice', 'records-request', 'deadline', 'police-notice', 'inspection', 'decision', 'release', 'lien-sale', 'hold-ending'],
  technician: ['inspection'],
  dispatcher: ['police-notice', 'no-space', 'no-photos', 'hold-ending'],
}

/** The section of the vehicle page (its element id) where each kind of work is done. */
export const TODAY_ANCHORS: Record<TodayKind, string> = {
  notice: 'notices',
  'records-request': 'contacts',
  deadline: 'notices',
  'police-notice': 'police-notice',
  inspection: 'inspection',
  decision: 'contacts',
  release: 'release',
  'lien-sale': 'bill',
  'hold-ending': 'holds',
  'no-space': 'space',
  'no-photos': 'photos',
}

/** overdue: its day has passed; today; week: within the next six days; now: waiting, with no date of its own. */
export const TODAY_WHEN = ['overdue', 'today', 'week', 'now'] as const

export const todayItemSchema = z.object({
  kind: z.enum(TODAY_KINDS),
  when: z.enum(TODAY_WHEN),
  vehicleId: z.uuid(),
  stockNumber: z.string(),
  vehicle: z.string(),
  plate: z.string().nullable(),
  /** The yard's calendar day it falls due (or, for waiting work, the day it started waiting). */
  day: z.string().nullable(),
  /** What exactly: the notice's kind, the hold's kind, the rule's label. */
  detail: z.string().nullable(),
  /** The detail in Spanish, where it is a rule's label the rule set has in Spanish. */
  es: z.object({ detail: z.string().optional() }).optional(),
  noticeKind: z.enum(NOTICE_KINDS).nullable(),
})
export type TodayItem = z.infer<typeof todayItemSchema>

export const todaySchema = z.object({
  role: z.enum(ROLES),
  today: z.string(),
  /** The last day of "this week": today and the six after it. */
  weekEnds: z.string(),
  timeZone: z.string(),
  items: z.array(todayItemSchema),
})
export type Today = z.infer<typeof todaySchema>
