import { and, eq, sql } from 'drizzle-orm'
import type { Database } from '@db/client'
import { appendHistory } from '@db/history'
import { vehicles } from '@db/schema'
import { checkMove, COLUMN_LABELS, factsOfCard } from '@shared/domain/lifecycle'
import type { BoardCard } from '@shared/schemas/board'
import type { moveRequestSchema } from '@shared/schemas/moves'
import type { User } from '@shared/schemas/users'
import type { z } from 'zod'
import { AppError, conflict, unprocessable } from '../errors'
import { boardChanged } from '../live/index'
import { vehicleForUser } from '../vehicles/index'
import { cardOf } from './board-cards'

export type Move = z.output<typeof moveRequestSchema>

/**
 * Moves one vehicle if the lifecycle allows it for this person now, with its history entry in the
 * same transaction. The vehicle row is locked first, so of two moves made from the same version
 * exactly one succeeds and the other sees the new version (409). A refused move writes nothing.
 */
export async function moveVehicle(db: Database, user: User, vehicleId: string, move: Move, now = new Date()): Promise<BoardCard> {
  const { card, yardId } = await db.transaction(async (tx) => {
    const { vehicle: row, yard } = await vehicleForUser(tx, user.id, vehicleId, true)
    const before = (await cardOf(tx, yard, vehicleId, now))!
    if (row.version !== move.version) {
      throw conflict(
        `Someone else changed ${before.stockNumber} a moment ago; it is now in ${COLUMN_LABELS[row.state]}. The board shows it as it is now — move it again if it still needs moving.`,
        { current: before },
      )
    }
    const verdict = checkMove({ from: row.state, to: move.to, role: user.role, facts: factsOfCard(before, yard.timeZone), disposition: move.disposition, reason: move.reason, now })
    if (!verdict.allowed) {
      const message = verdict.reasons.map((r) => r.message).join(' ')
      throw verdict.forbidden ? new AppError(403, message, { reasons: verdict.reasons }) : unprocessable(message, { reasons: verdict.reasons })
    }
    const closing = move.to === 'closed'
    await tx
      .update(vehicles)
      .set({ state: move.to, version: sql`${vehicles.version} + 1`, updatedAt: now, ...(closing ? { disposition: move.disposition, closedAt: now, spaceId: null } : {}) })
      .where(and(eq(vehicles.id, vehicleId), eq(vehicles.version, move.version)))
    await appendHistory(tx, {
      vehicleId,
      actorId: user.id,
      actorLabel: user.name,
      kind: 'moved',
      fromState: row.state,
      toState: move.to,
      reason: move.reason,
      after: closing ? { disposition: move.disposition, spaceGivenBack: before.space } : null,
      at: now,
    }, { vehicleLocked: true })
    // Only the column, the version and (when closing) the way out and the space change: the rest of the card stands.
    const after: BoardCard = { ...before, state: move.to, version: row.version + 1, ...(closing ? { disposition: move.disposition, space: null } : {}) }
    return { card: after, yardId: yard.id }
  })
  await boardChanged(db, { yardId, vehicleId, cause: 'moved', card })
  return card
}
