// Why a vehicle was towed: the reason decides who may claim it and which papers the yard must keep.
export const TOW_REASONS = [
  'breakdown',
  'accident',
  'private_property',
  'law_enforcement',
  'owner_request',
  'repossession',
  'other',
] as const
export type TowReason = (typeof TOW_REASONS)[number]

export const TOW_REASON_LABELS: Record<TowReason, string> = {
  breakdown: 'Breakdown',
  accident: 'Accident',
  private_property: 'Private-property tow',
  law_enforcement: 'Law-enforcement request',
  owner_request: 'Owner request',
  repossession: 'Repossession',
  other: 'Other',
}
