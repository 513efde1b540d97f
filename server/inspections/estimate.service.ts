import { and, eq } from 'drizzle-orm'
import type { z } from 'zod'
import type { Tx } from '@db/client'
import { inspectionLines, inspections } from '@db/schema'
import { hoursToHundredths, lineCents } from '@shared/domain/inspection'
import type { estimateLineSchema, valuesSchema } from '@shared/schemas/inspections'
import type { User } from '@shared/schemas/users'
import { notFound } from '../errors'
import type { VehicleChanges } from '../vehicles/index'
import { changeInspection } from './inspection-change'
import type { LineRow } from './inspections.queries'

type LineInput = z.output<typeof estimateLineSchema>
type Values = z.output<typeof valuesSchema>

const stored = (input: LineInput) => ({
  itemCode: input.itemCode,
  part: input.part,
  quantity: input.quantity,
  unitPriceCents: input.unitPriceCents,
  labourHundredths: hoursToHundredths(input.labourHours)!,
})

// What the history keeps of a line: enough to reprice it by hand.
const proof = (l: Pick<LineRow, 'part' | 'quantity' | 'unitPriceCents' | 'labourHundredths' | 'labourRateCents' | 'itemCode'>) => ({
  item: l.itemCode,
  part: l.part,
  quantity: l.quantity,
  unitPriceCents: l.unitPriceCents,
  labourHours: l.labourHundredths / 100,
  labourRateCents: l.labourRateCents,
  totalCents: lineCents(l).totalCents,
})

/** A line priced at the yard's labour rate of today; the rate stays with the line. */
export async function addLine(changes: VehicleChanges, actor: User, vehicleId: string, input: LineInput): Promise<string> {
  const { result } = await changeInspection(changes, actor, vehicleId, 'open', async ({ tx, inspection, yard, now, record }) => {
    const values = { ...stored(input), labourRateCents: yard.labourRateCents }
    const [row] = await tx.insert(inspectionLines).values({ inspectionId: inspection.id, createdById: actor.id, createdAt: now, ...values }).returning()
    record({ kind: 'estimate_line_added', after: { inspectionId: inspection.id, lineId: row!.id, ...proof(row!) } })
    return row!.id
  })
  return result
}

async function lineOf(tx: Tx, inspectionId: string, lineId: string) {
  const [line] = await tx.select().from(inspectionLines).where(and(eq(inspectionLines.id, lineId), eq(inspectionLines.inspectionId, inspectionId)))
  if (!line) throw notFound('That estimate line')
  return line
}

/** Changes a line; it keeps the labour rate it was written at. */
export async function changeLine(changes: VehicleChanges, actor: User, vehicleId: string, lineId: string, input: LineInput): Promise<void> {
  await changeInspection(changes, actor, vehicleId, 'open', async ({ tx, inspection, record }) => {
    const before = await lineOf(tx, inspection.id, lineId)
    const [after] = await tx.update(inspectionLines).set(stored(input)).where(eq(inspectionLines.id, lineId)).returning()
    record({ kind: 'estimate_line_changed', before: proof(before), after: { lineId, ...proof(after!) } })
  })
}

export async function removeLine(changes: VehicleChanges, actor: User, vehicleId: string, lineId: string): Promise<void> {
  await changeInspection(changes, actor, vehicleId, 'open', async ({ tx, inspection, record }) => {
    const before = await lineOf(tx, inspection.id, lineId)
    await tx.delete(inspectionLines).where(eq(inspectionLines.id, lineId))
    record({ kind: 'estimate_line_removed', before: { lineId, ...proof(before) } })
  })
}

/**
 * The vehicle's value and salvage value, with where each came from. The value also becomes the
 * vehicle's estimated value, which picks the lien clocks' value branch — so the board's next
 * deadline may change, and the history shows the value before and after.
 */
export async function setValues(changes: VehicleChanges, actor: User, vehicleId: string, input: Values): Promise<void> {
  await changeInspection(changes, actor, vehicleId, 'any', async ({ tx, vehicle, inspection, now: at, set, record }) => {
    await tx
      .update(inspections)
      .set({ ...input, valuesEnteredById: actor.id, valuesEnteredAt: at })
      .where(eq(inspections.id, inspection.id))
    set({ estimatedValueCents: input.actualCashValueCents, estimatedValueSource: `The inspection: ${input.actualCashValueSource}` })
    const { actualCashValueCents, actualCashValueSource, salvageValueCents, salvageValueSource } = inspection
    record({
      kind: 'vehicle_values_entered',
      before: { actualCashValueCents, actualCashValueSource, salvageValueCents, salvageValueSource, estimatedValueCents: vehicle.estimatedValueCents },
      after: { inspectionId: inspection.id, ...input, estimatedValueCents: input.actualCashValueCents },
      at,
    })
  })
}
