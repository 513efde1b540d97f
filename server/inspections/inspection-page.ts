import type { Executor } from '@db/client'
import { estimateTotals, pickupBadge, repairOrSalvage } from '@shared/domain/inspection'
import type { Inspection, InspectionPage } from '@shared/schemas/inspections'
import type { RuleSet } from '@shared/schemas/rule-sets'
import { versionsById } from '../rule-sets/index'
import { holdsOf, vehicleForUser, type VehicleRow } from '../vehicles/index'
import { itemsOf, latestInspection, lineView, linesOf, namesOf, photosByItem, type InspectionRow } from './inspections.queries'
import { ruleSetTitle } from '@shared/messages/rule-words'

const title = (v: VehicleRow) => [v.year, v.make, v.model].filter(Boolean).join(' ') || 'Unknown vehicle'

/** Everything the teardown screen shows: the vehicle, the latest inspection, the estimate, the recommendation, the pickup badge. */
export async function inspectionPage(db: Executor, userId: string, vehicleId: string): Promise<InspectionPage> {
  const { vehicle: v, yard } = await vehicleForUser(db, userId, vehicleId)
  const { ruleSet, inspection, recommendation, missing } = await inspectionOf(db, v)
  return {
    vehicle: {
      id: v.id,
      stockNumber: v.stockNumber,
      title: title(v),
      state: v.state,
      version: v.version,
      rolls: v.rolls,
      steers: v.steers,
      brakes: v.brakes,
      keys: v.keys,
      conditionNotes: v.conditionNotes,
    },
    timeZone: yard.timeZone,
    labourRateCents: yard.labourRateCents,
    ruleSet: ruleSet ? ruleSetTitle(ruleSet) : null,
    inspection,
    recommendation,
    recommendationMissing: missing,
    pickup: pickupBadge(v),
    holds: (await holdsOf(db, v.id)).filter((h) => h.liftedAt === null),
  }
}

/**
 * A vehicle's latest inspection with the core's repair-or-salvage call (or why it cannot be made),
 * for a caller that has already found the vehicle: the teardown screen, the owner's page.
 */
export async function inspectionOf(db: Executor, v: VehicleRow) {
  const ruleSet = v.ruleSetVersionId ? (await versionsById(db, [v.ruleSetVersionId])).get(v.ruleSetVersionId) : undefined
  const row = await latestInspection(db, v.id)
  const inspection = row ? await inspectionView(db, v.id, row) : null
  return { ruleSet, inspection, ...recommend(inspection, ruleSet) }
}

async function inspectionView(db: Executor, vehicleId: string, row: InspectionRow): Promise<Inspection> {
  const [items, lines, photos] = await Promise.all([itemsOf(db, row.id), linesOf(db, row.id), photosByItem(db, vehicleId, row.id)])
  const names = await namesOf(db, [row.startedById, row.safetyAcknowledgedById, row.finishedById, row.valuesEnteredById])
  const by = (id: string | null, at: Date | null) => (id && at ? { by: names.get(id) ?? 'Unknown', at: at.toISOString() } : null)
  // An item with photos but no mark yet still shows its photos.
  const codes = new Set([...items.map((i) => i.itemCode), ...photos.keys()])
  const itemRows = new Map(items.map((i) => [i.itemCode, i]))
  return {
    id: row.id,
    started: by(row.startedById, row.startedAt)!,
    safetyAcknowledged: by(row.safetyAcknowledgedById, row.safetyAcknowledgedAt),
    finished: by(row.finishedById, row.finishedAt),
    wheelRefitted: row.wheelRefitted,
    lugTorqueFtLbf: row.lugTorqueFtLbf,
    items: [...codes].map((code) => ({
      code,
      status: itemRows.get(code)?.status ?? 'not_checked',
      note: itemRows.get(code)?.note ?? null,
      photos: photos.get(code) ?? [],
    })),
    lines: lines.map(lineView),
    totals: estimateTotals(lines),
    values:
      row.actualCashValueCents === null
        ? null
        : {
            actualCashValueCents: row.actualCashValueCents,
            actualCashValueSource: row.actualCashValueSource ?? '',
            salvageValueCents: row.salvageValueCents ?? 0,
            salvageValueSource: row.salvageValueSource ?? '',
            entered: by(row.valuesEnteredById, row.valuesEnteredAt),
          },
  }
}

/** The core's repair-or-salvage call on the estimate and the values, or why it cannot be made yet. */
function recommend(inspection: Inspection | null, ruleSet: RuleSet | undefined) {
  if (!inspection) return { recommendation: null, missing: 'No inspection yet.' }
  if (!ruleSet) return { recommendation: null, missing: 'This vehicle has no rule set, so there is no total-loss rule to compare by.' }
  if (!inspection.values) return { recommendation: null, missing: "Enter the vehicle's value and its salvage value to compare them with the estimate." }
  const { actualCashValueCents, salvageValueCents } = inspection.values
  return { recommendation: repairOrSalvage(inspection.totals.totalCents, actualCashValueCents, salvageValueCents, ruleSet), missing: null }
}
