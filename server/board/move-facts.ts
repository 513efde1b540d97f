import type { Executor } from '@db/client'
import type { MoveFacts } from '@shared/domain/lifecycle'
import { summarizeVehicles } from '../charges/index'
import type { VehicleRow, YardRow } from '../vehicles/index'
import { moneyTotals } from '../billing/index'
import { handoverMoney, holdFact, NOTHING_RECORDED } from './board-cards'
import { activeHolds } from './board.queries'
import { releaseFacts } from './handover.queries'

/**
 * What the lifecycle judges a move by, read for one vehicle under its lock: its active holds and
 * its inspection mark, and its bill and lien-sale gate only when the move's guards read them
 * (`withBill`, from readsBill). The same facts a board card gives the client, without the card.
 */
export async function moveFacts(db: Executor, vehicle: VehicleRow, yard: YardRow, withBill: boolean, asOf: Date): Promise<MoveFacts> {
  const holds = await activeHolds(db, yard.id, [vehicle.id])
  const summary = withBill ? ((await summarizeVehicles(db, yard, [vehicle], asOf)).get(vehicle.id) ?? null) : null
  const money = withBill ? handoverMoney((await moneyTotals(db, [vehicle.id])).get(vehicle.id), summary?.balanceCents ?? null) : {}
  return {
    timeZone: yard.timeZone,
    holds: holds.map(holdFact),
    inspected: vehicle.inspectedAt !== null,
    balanceCents: summary?.balanceCents ?? null,
    lienSale: summary?.lienSale ?? null,
    ...NOTHING_RECORDED,
    ...money,
    ...(await releaseFacts(db, [vehicle.id])).get(vehicle.id),
  }
}
