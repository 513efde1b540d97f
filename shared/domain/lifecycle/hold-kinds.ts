// A hold blocks release until it is lifted; a law-enforcement hold names the agency and its case.
export const HOLD_KINDS = ['law_enforcement', 'lien', 'dispute', 'other'] as const
export type HoldKind = (typeof HOLD_KINDS)[number]

/**
 * The holds a move into Teardown asks about first (issue 16): a law-enforcement hold often means the
 * vehicle is evidence — do not take it apart until the agency says so.
 */
export const handsOffHolds = <H extends { kind: HoldKind }>(holds: readonly H[]): H[] => holds.filter((h) => h.kind === 'law_enforcement')

export const HOLD_LABELS: Record<HoldKind, string> = {
  law_enforcement: 'Law-enforcement hold',
  lien: 'Lien hold',
  dispute: 'Dispute',
  other: 'Other hold',
}
