import { checkMove, COLUMN_LABELS, handsOffHolds, readsBill, type Verdict } from '@shared/domain/lifecycle'
import type { BoardCard } from '@shared/schemas/board'
import type { moveRequestSchema } from '@shared/schemas/moves'
import type { User } from '@shared/schemas/users'
import type { z } from 'zod'
import type { Executor } from '@db/client'
import { AppError, conflict, unprocessable, said } from '../errors'
import { changeVehicle, spaceOf, type VehicleChanges, type VehicleRow, type VehicleWork, type YardRow } from '../vehicles/index'
import { activeHolds } from './board.queries'
import { cardOf } from './board-cards'
import { moveFacts } from './move-facts'

export type Move = z.output<typeof moveRequestSchema>
/** A move as another service makes it (the gate's record-out): no version, the lock is the caller's. */
export type JudgedMove = Pick<Move, 'to' | 'disposition' | 'reason'>

/** The lifecycle's verdict on this move for this person now, on facts read for this one vehicle. */
export async function judgeMove(db: Executor, vehicle: VehicleRow, yard: YardRow, user: User, move: JudgedMove, now: Date): Promise<Verdict> {
  const facts = await moveFacts(db, vehicle, yard, readsBill(vehicle.state, move.to, move.disposition), now)
  return checkMove({ from: vehicle.state, to: move.to, role: user.role, facts, disposition: move.disposition, reason: move.reason, now })
}

/**
 * Inside a change's transaction: judges the move on the locked vehicle and, if the lifecycle allows
 * it, sets the new state and records it; otherwise throws the reasons (403 for the role, else 422).
 * `after` adds to the history event what made the move (a gate pass).
 */
export async function makeMove({ tx, vehicle, yard, actor, set, record }: VehicleWork, move: JudgedMove, now: Date, after: Record<string, unknown> = {}) {
  const verdict = await judgeMove(tx, vehicle, yard, actor, move, now)
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
    after: closing ? { disposition: move.disposition, spaceGivenBack, ...after } : null,
    at: now,
  })
}

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
    async (work) => {
      if (move.to === 'teardown' && !move.confirmHold) await refuseUnaskedTeardown(work)
      await makeMove(work, move, now)
    },
    {
      expectedVersion: move.version,
      stale: async ({ tx, vehicle, yard }) =>
        conflict(
          `Someone else changed ${vehicle.stockNumber} a moment ago; it is now in ${COLUMN_LABELS[vehicle.state]}. The board shows it as it is now — move it again if it still needs moving.`,
          said('movedElsewhere', { stock: vehicle.stockNumber, column: vehicle.state }, { current: await cardOf(tx, yard, vehicleId, now) }),
        ),
      card: async (db, yard) => cardOf(db, yard, vehicleId, now),
    },
  )
  return card!
}

/**
 * Issue 16: a law-enforcement hold usually means the vehicle is evidence — do not take it apart. A move
 * into Teardown under one (from the board, a phone or any API client) is refused, nothing written, until
 * it is sent again with `confirmHold: true`, i.e. the person was shown the hold and said go on.
 */
async function refuseUnaskedTeardown({ tx, vehicle, yard }: VehicleWork) {
  const hold = handsOffHolds(await activeHolds(tx, yard.id, [vehicle.id]))[0]
  if (!hold) return
  const params = { stock: vehicle.stockNumber, agency: hold.agency ?? '—', caseNumber: hold.caseNumber ?? '—' }
  throw conflict(
    `${params.stock} is under a law-enforcement hold (${params.agency}, case ${params.caseNumber}): an evidence hold usually means do not take it apart. Confirm the move to Teardown to go on.`,
    said('teardownUnderHold', params, { hold: { kind: hold.kind, agency: hold.agency, caseNumber: hold.caseNumber } }),
  )
}
