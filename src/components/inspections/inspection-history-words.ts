import { FINDING_LABELS, itemName, type FindingStatus } from '@shared/domain/inspection'
import { formatCents } from '@shared/domain/billing'

// Plain words for what the teardown's history entries record (server/inspections), for the timeline.
export const INSPECTION_FIELD_LABELS: Record<string, string> = {
  item: 'Item', status: 'Finding', part: 'Part or job', quantity: 'How many', unitPriceCents: 'Price each', labourHours: 'Labour hours',
  labourRateCents: 'Labour rate', totalCents: 'Line total', estimateCents: 'Estimate', actualCashValueCents: 'Value',
  actualCashValueSource: 'Value from', salvageValueCents: 'Salvage value', salvageValueSource: 'Salvage value from',
  estimatedValueCents: 'Value for the lien clocks', rolls: 'Rolls', steers: 'Steers', brakes: 'Brakes', wheelRefitted: 'Wheel refitted',
  lugTorqueFtLbf: 'Lug-nut torque (ft·lbf)', pickupNeeds: 'Pickup needs', broken: 'Broken', worn: 'Worn', recommendation: 'Advice',
  reinspection: 'Re-inspection', inspectedAt: 'Inspected', cautions: 'Cautions read',
}

export const INSPECTION_HIDDEN = ['inspectionId', 'lineId', 'previousInspectionId', 'name']

/** The teardown's own way of showing a value, or undefined to leave it to the general rules. */
export function inspectionValue(key: string, value: unknown): string | undefined {
  if (key.endsWith('Cents') && typeof value === 'number') return formatCents(value)
  if (key === 'status' && typeof value === 'string' && value in FINDING_LABELS) return FINDING_LABELS[value as FindingStatus]
  if (key === 'item' && typeof value === 'string') return itemName(value)
  if ((key === 'broken' || key === 'worn') && Array.isArray(value)) return value.map((v) => itemName(String(v))).join(', ') || '—'
  return undefined
}
