import type { BoardCard } from '../../schemas/board'
import type { MoveFacts } from './lifecycle-guards'

/** The facts the lifecycle judges a move by, read from a board card — the same on both sides. */
export function factsOfCard(card: BoardCard, timeZone: string): MoveFacts {
  return {
    timeZone,
    holds: card.holds,
    inspected: card.inspectedAt !== null,
    balanceCents: card.summary?.balanceCents ?? null,
    paidCents: card.handover.paidCents,
    creditedCents: card.handover.creditedCents,
    waived: card.handover.waived,
    claimantIdRecorded: card.handover.claimantIdRecorded,
    releaseSigned: card.handover.releaseSigned,
    transferSigned: card.handover.transferSigned,
    lienSaleSigned: card.handover.lienSaleSigned,
    lienSale: card.summary?.lienSale ?? null,
  }
}
