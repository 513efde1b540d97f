import { ownerDecisions } from '@db/schema'
import type { ownerDecisionInputSchema } from '@shared/schemas/owner'
import type { z } from 'zod'
import { AppError, conflict, said } from '../errors'
import { changeVehicleAsOwner, type VehicleChanges } from '../vehicles/index'
import { linkStatus, openLinkOf, type OwnerLinkRow } from './owner.queries'

type DecisionInput = z.output<typeof ownerDecisionInputSchema>

/**
 * The owner's choice, made through their link: kept in full (time, address, the name they typed),
 * written on the vehicle for the board's badge, and an event in the vehicle's history — one change,
 * so the office's boards hear of it at once. The link is checked again inside the transaction.
 */
export async function recordDecision(
  changes: VehicleChanges,
  link: OwnerLinkRow,
  input: DecisionInput,
  from: { ip: string; userAgent: string | null },
): Promise<void> {
  const label = `${input.fullName} (owner, by link)`
  await changeVehicleAsOwner(changes, label, link.vehicleId, async ({ tx, vehicle, set, record }) => {
    const open = await openLinkOf(tx, link.vehicleId, link.id)
    if (!open || linkStatus(open, new Date()) !== 'active') throw new AppError(410, 'This link no longer works. Ask the yard for a new one.', said('ownerLinkGone'))
    if (vehicle.state === 'closed') throw conflict('This vehicle has already left the yard, so there is nothing left to choose.', said('closedOwnerChoice'))
    const [row] = await tx
      .insert(ownerDecisions)
      .values({
        vehicleId: link.vehicleId,
        linkId: link.id,
        choice: input.choice,
        signOverTo: input.choice === 'sign_over' ? input.signOverTo : null,
        fullName: input.fullName,
        phone: input.phone,
        note: input.note,
        ip: from.ip,
        userAgent: from.userAgent?.slice(0, 300) ?? null,
      })
      .returning()
    set({ ownerChoice: row!.choice, ownerChoiceAt: row!.at })
    record({
      kind: 'owner_decided',
      before: vehicle.ownerChoice ? { choice: vehicle.ownerChoice } : null,
      after: { choice: row!.choice, signOverTo: row!.signOverTo, fullName: row!.fullName, phone: row!.phone, note: row!.note, ip: row!.ip, linkId: link.id },
    })
  })
}
