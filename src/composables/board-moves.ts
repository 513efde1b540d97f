import { reactive } from 'vue'
import { checkMove, type Disposition, factsOfCard, handsOffHolds, moveOptions, type VehicleState } from '@shared/domain/lifecycle'
import type { BoardCard } from '@shared/schemas/board'
import { moveConflictSchema, moveRefusalSchema } from '@shared/schemas/moves'
import { useMoveVehicleMutation } from '@/api/board'
import { ApiError } from '@/api/http'
import { i18n } from '@/i18n'
import { reasonText } from './refusal-words'
import { useSessionStore } from '@/stores/session'
import { useBoardCache } from './board-cache'

export interface MoveDetails {
  reason?: string | null
  disposition?: Disposition | null
  /** The person was shown the law-enforcement hold and said go on (a move into Teardown, issue 16). */
  confirmHold?: boolean
}

export type MoveOutcome =
  | { ok: true; card: BoardCard; title: string }
  | { ok: false; title: string; reasons: string[]; conflict?: true }

const { t } = i18n.global
const done = (card: BoardCard, to: VehicleState, d?: Disposition | null) =>
  to === 'closed' && d
    ? t('board.closedAs', { stock: card.stockNumber, disposition: t(`lifecycle.dispositions.${d}`).toLowerCase() })
    : t('board.movedTo', { stock: card.stockNumber, column: t(`lifecycle.columns.${to}`) })
const cannot = (card: BoardCard, to: VehicleState) =>
  to === 'closed' ? t('board.cannotClose', { stock: card.stockNumber }) : t('board.cannotGo', { stock: card.stockNumber, column: t(`lifecycle.columns.${to}`) })

/**
 * Board moves through the shared lifecycle: refused at once with its reasons when the rules say no,
 * otherwise shown in the new column straight away and put back if the server refuses.
 */
export function useBoardMoves() {
  const cache = useBoardCache()
  const send = useMoveVehicleMutation()
  const session = useSessionStore()
  const pending = reactive(new Set<string>())
  const zone = () => cache.get()?.yard.timeZone ?? 'UTC'

  const verdict = (card: BoardCard, to: VehicleState, details: MoveDetails = {}) =>
    checkMove({ from: card.state, to, role: session.user!.role, facts: factsOfCard(card, zone()), ...details })

  const options = (card: BoardCard) => moveOptions(card.state, session.user!.role, factsOfCard(card, zone()))

  async function move(card: BoardCard, to: VehicleState, details: MoveDetails = {}): Promise<MoveOutcome> {
    const v = verdict(card, to, details)
    if (!v.allowed) return { ok: false, title: cannot(card, to), reasons: v.reasons.map(reasonText) }
    pending.add(card.id)
    cache.place(card, to === 'closed' ? 'closed' : to)
    try {
      const updated = await send.mutateAsync({ id: card.id, move: { to, version: card.version, reason: details.reason, disposition: details.disposition, confirmHold: details.confirmHold } })
      cache.put(updated)
      return { ok: true, card: updated, title: done(card, to, details.disposition) }
    } catch (e) {
      const conflict = e instanceof ApiError && e.status === 409 ? moveConflictSchema.safeParse(e.body) : null
      if (conflict?.success) {
        cache.put(conflict.data.current)
        return { ok: false, conflict: true, title: t('board.changedElsewhere', { stock: card.stockNumber }), reasons: [(e as Error).message] }
      }
      cache.put(card)
      const refusal = e instanceof ApiError ? moveRefusalSchema.safeParse(e.body) : null
      return { ok: false, title: cannot(card, to), reasons: refusal?.success ? refusal.data.reasons.map(reasonText) : [(e as Error).message] }
    } finally {
      pending.delete(card.id)
    }
  }

  /** A move into Teardown under a law-enforcement hold asks first (the move dialog shows the hold). */
  const asksFirst = (card: BoardCard, to: VehicleState) => to === 'teardown' && handsOffHolds(card.holds).length > 0

  return { move, verdict, options, pending, asksFirst }
}
