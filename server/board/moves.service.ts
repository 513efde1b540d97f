import { checkMove, COLUMN_LABELS, readsBill } from '@shared/domain/lifecycle'
import type { BoardCard } from '@shared/schemas/board'
import type { moveRequestSchema } from '@shared/schemas/moves'
import type { User } from '@shared/schemas/users'
import type { z } from 'zod'
import { AppError, conflict, unprocessable } from '../errors'
import { changeVehicle, spaceOf, type VehicleChanges } from '../vehicles/index'
import { cardOf } from './board-cards'
import { moveFacts } from './move-facts'

export type Move = z.output<typeof moveRequestSchema>

/**
 * Moves one vehicle if the lifecycle allows it for this person now. The unit of work locks the row
 * first, so of two moves made from the same version exactly one succeeds and the other sees the new
 * version (409, with the card as it is now). A refused move writes nothing. The new card is built
 * once, after the commit, for the answer and the boards.
 */
export async function moveVehicle(changes: VehicleChanges, user: User, vehicleId: string, move: Move, now = new Date()): Promise<BoardCard> {
  const { card } = await changeVehicle(
    changes,
    user,
    vehicleId,
    async ({ tx, vehicle, yard, set, record }) => {
      const facts = await moveFacts(tx, vehicle, yard, readsBill(vehicle.state, move.to, move.disposition), now)
      const verdict = checkMove({ from: vehicle.state, to: move.to, role: user.role, facts, disposition: move.disposition, reason: move.reason, now })
      if (!verdict.allowed) {
        const message = verdict.reasons.map((r) => r.message).join(' ')
        throw verdict.forbidden ? new AppError(403, message, { reasons: verdict.reasons }) : unprocessable(message, { reasons: verdict.reasons })
      }
      const closing = move.to === 'closed'
      set({ state: move.to, ...(closing ? { disposition: move.disposition, closedAt: now, spaceId: null } : {}) })
      const spaceGivenBack = closing ? ((await spaceOf(tx, vehicle.spaceId))?.label ?? null) : null
      record({
        kind: 'moved',
        fromState: vehicle.state,
        toState: move.to,
        reason: move.reason,
        after: closing ? { disposition: move.disposition, spaceGivenBack } : null,
        at: now,
      })
    },
    {
      expectedVersion: move.version,
      stale: async ({ tx, vehicle, yard }) =>
        conflict(
          `Someone else changed ${vehicle.stockNumber} a moment ago; it is now in ${COLUMN_LABELS[vehicle.state]}. The board shows it as it is now — move it again if it still needs moving.`,
          { current: await cardOf(tx, yard, vehicleId, now) },
        ),
      card: async (db, yard) => cardOf(db, yard, vehicleId, now),
    },
  )
  return card!
}
