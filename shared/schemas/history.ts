import { z } from 'zod'

/**
 * Every kind of event a vehicle's history holds, as stored in history_events.kind. The server
 * appends only these (db/history.ts) and every word map keyed by them must name them all.
 */
export const HISTORY_KINDS = [
  'towed_in',
  'corrected',
  'hold_set',
  'hold_lifted',
  'file_added',
  'space_assigned',
  'moved',
  'inspection_started',
  'safety_acknowledged',
  'inspection_item_marked',
  'estimate_line_added',
  'estimate_line_changed',
  'estimate_line_removed',
  'vehicle_values_entered',
  'vehicle_value_recorded',
  'roll_ability_marked',
  'inspection_finished',
  'owner_link_created',
  'owner_link_revoked',
  'owner_decided',
  'payment_taken',
  'payment_refunded',
  'charges_adjusted',
  'adjustment_requested',
  'adjustment_declined',
  'police_notified',
  'contact_added',
  'contact_changed',
  'contact_removed',
  'records_requested',
  'records_answered',
  'notice_made',
  'notice_sent',
  'notice_returned',
  'release_claimant_recorded',
  'release_id_photo_added',
  'release_handover_recorded',
  'release_photos_added',
  'release_signed',
  'gate_pass_issued',
  'rule_set_changed',
] as const
export type HistoryKind = (typeof HISTORY_KINDS)[number]

export const historyEventSchema = z.object({
  seq: z.number(),
  at: z.string(),
  actor: z.string(),
  kind: z.enum(HISTORY_KINDS),
  fromState: z.string().nullable(),
  toState: z.string().nullable(),
  reason: z.string().nullable(),
  before: z.record(z.string(), z.unknown()).nullable(),
  after: z.record(z.string(), z.unknown()).nullable(),
  hash: z.string(),
})
export type HistoryEvent = z.infer<typeof historyEventSchema>

export const historySchema = z.object({ events: z.array(historyEventSchema) })

export const chainCheckSchema = z.object({
  ok: z.boolean(),
  events: z.number(),
  brokenAt: z.object({ seq: z.number(), reason: z.string() }).optional(),
})
export type ChainCheck = z.infer<typeof chainCheckSchema>

/** Plain words for each kind of event, as the timeline shows them. */
export const HISTORY_LABELS: Record<HistoryKind, string> = {
  towed_in: 'Towed in',
  corrected: 'Record corrected',
  hold_set: 'Hold set',
  hold_lifted: 'Hold lifted',
  file_added: 'File added',
  space_assigned: 'Space assigned',
  moved: 'Moved',
  inspection_started: 'Inspection started',
  safety_acknowledged: 'Safety cautions read',
  inspection_item_marked: 'Finding marked',
  estimate_line_added: 'Estimate line added',
  estimate_line_changed: 'Estimate line changed',
  estimate_line_removed: 'Estimate line removed',
  vehicle_values_entered: 'Value entered',
  vehicle_value_recorded: 'Value recorded',
  roll_ability_marked: 'Rolls, steers, brakes marked',
  inspection_finished: 'Inspection finished',
  owner_link_created: 'Owner link created',
  owner_link_revoked: 'Owner link revoked',
  owner_decided: "Owner's decision",
  payment_taken: 'Payment taken',
  payment_refunded: 'Refund given',
  charges_adjusted: 'Charges waived or discounted',
  adjustment_requested: 'Waiver or discount requested',
  adjustment_declined: 'Waiver or discount declined',
  police_notified: 'Police told of the tow',
  contact_added: 'Contact added',
  contact_changed: 'Contact changed',
  contact_removed: 'Contact removed',
  records_requested: 'Owner records requested',
  records_answered: 'Records request answered',
  notice_made: 'Notice letter made',
  notice_sent: 'Notice sent',
  notice_returned: 'Notice returned',
  release_claimant_recorded: 'Claimant and ID recorded',
  release_id_photo_added: 'ID photo added',
  release_handover_recorded: 'Odometer and property at release',
  release_photos_added: 'Photos at release',
  release_signed: 'Release signed',
  gate_pass_issued: 'Gate pass issued',
  rule_set_changed: 'Moved to a new rule-set version',
}
