import { COLUMN_LABELS, HOLD_LABELS, type HoldKind, type VehicleState } from '@shared/domain/lifecycle'
import { formatCents } from '@shared/domain/billing'
import { TOW_REASON_LABELS, type TowReason } from '@shared/domain/tow'
import { i18n } from '@/i18n'
import { INSPECTION_FIELD_LABELS, INSPECTION_HIDDEN, inspectionValue } from '@/components/inspections/inspection-history-words'

// Plain words for the fields a history event names; anything unlisted shows its own name.
const FIELD_LABELS: Record<string, string> = {
  stockNumber: 'Stock number', vin: 'VIN', vinOverrideReason: 'VIN reason', plate: 'Plate', plateState: 'Plate state', year: 'Year',
  make: 'Make', model: 'Model', colour: 'Colour', body: 'Body', vehicle: 'Vehicle', vehicleClass: 'Class', odometer: 'Odometer',
  odometerUnreadable: 'Odometer not readable', keys: 'Keys', keysWhere: 'Where the keys are', drivableAsFound: 'Drivable as found',
  ownerName: 'Registered owner', conditionNotes: 'Damage notes', pickup: 'Picked up at', pickupAddress: 'Pickup address',
  pickupLat: 'Pickup latitude', pickupLng: 'Pickup longitude', reason: 'Why towed', reasonNote: 'Reason note', requesterName: 'Asked by',
  requesterAgency: 'Agency', requesterReference: 'Their reference', calledAt: 'Called', hookedAt: 'Hooked up', arrivedAt: 'Arrived',
  truck: 'Truck', driver: 'Driver', roadMiles: 'Road miles', winchingUnits: 'Winching units', dollies: 'Dollies', afterHours: 'After hours',
  chargeCents: 'Tow charge', space: 'Space', propertyItems: 'Property items', kind: 'Kind', agency: 'Agency', caseNumber: 'Case number',
  until: 'Until', note: 'Note', files: 'Files', ...INSPECTION_FIELD_LABELS,
}

const HIDDEN = new Set(['holdId', ...INSPECTION_HIDDEN])

// Fields whose words have moved to the message catalogs (read at render, so they follow the language).
const CATALOG_LABELS: Record<string, string> = { estimatedValueSource: 'clocks.value.historySource' }

export function fieldLabel(key: string): string {
  const catalogKey = CATALOG_LABELS[key]
  return catalogKey ? i18n.global.t(catalogKey) : (FIELD_LABELS[key] ?? key)
}

export function fieldValue(key: string, value: unknown, at: (iso: string) => string): string {
  if (value === null || value === undefined || value === '') return '—'
  const teardown = inspectionValue(key, value)
  if (teardown !== undefined) return teardown
  if (typeof value === 'boolean') return value ? 'Yes' : 'No'
  if (key === 'chargeCents' && typeof value === 'number') return formatCents(value)
  if (key === 'reason' && typeof value === 'string' && value in TOW_REASON_LABELS) return TOW_REASON_LABELS[value as TowReason]
  if (key === 'kind' && typeof value === 'string' && value in HOLD_LABELS) return HOLD_LABELS[value as HoldKind]
  if (typeof value === 'string' && /^\d{4}-\d{2}-\d{2}T/.test(value)) return at(value)
  if (Array.isArray(value)) return `${value.length}`
  return String(value)
}

export const shownKeys = (record: Record<string, unknown> | null) => Object.keys(record ?? {}).filter((k) => !HIDDEN.has(k) && k !== 'files')

export const stateLabel = (s: string | null) => (s ? (COLUMN_LABELS[s as VehicleState] ?? s) : '')
