// A hold blocks release until it is lifted; a law-enforcement hold names the agency and its case.
export const HOLD_KINDS = ['law_enforcement', 'lien', 'dispute', 'other'] as const
export type HoldKind = (typeof HOLD_KINDS)[number]

export const HOLD_LABELS: Record<HoldKind, string> = {
  law_enforcement: 'Law-enforcement hold',
  lien: 'Lien hold',
  dispute: 'Dispute',
  other: 'Other hold',
}
