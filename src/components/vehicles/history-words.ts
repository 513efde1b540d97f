import { i18n } from '@/i18n'
import { money } from '@/composables/money'
import { INSPECTION_HIDDEN, inspectionFieldLabel, inspectionValue } from '@/components/inspections/inspection-history-words'

// Plain words, in the reader's language, for the fields a history event names (vehicles.history.fields
// in the catalogs); anything unlisted shows its own name.
const { t, te } = i18n.global
const HIDDEN = new Set(['holdId', ...INSPECTION_HIDDEN])

// Fields whose words have moved to the message catalogs (read at render, so they follow the language).
const CATALOG_LABELS: Record<string, string> = { estimatedValueSource: 'clocks.value.historySource' }

export function fieldLabel(key: string): string {
  const catalogKey = CATALOG_LABELS[key]
  if (catalogKey) return t(catalogKey)
  if (te(`vehicles.history.fields.${key}`)) return t(`vehicles.history.fields.${key}`)
  if (te(`release.history.fields.${key}`)) return t(`release.history.fields.${key}`)
  return inspectionFieldLabel(key) ?? key
}

// Fields whose values are codes with their words in a catalog group (the release's, the lifecycle's).
const CODED_VALUES: Record<string, string> = {
  claimantKind: 'releases.claimantKinds',
  idType: 'releases.idTypes',
  authorityKind: 'releases.authorityKinds',
  disposition: 'lifecycle.dispositions',
}

export function fieldValue(key: string, value: unknown, at: (iso: string) => string): string {
  if (value === null || value === undefined || value === '') return '—'
  const teardown = inspectionValue(key, value)
  if (teardown !== undefined) return teardown
  if (typeof value === 'boolean') return t(value ? 'common.yes' : 'common.no')
  if (key === 'chargeCents' && typeof value === 'number') return money(value)
  if (key === 'reason' && typeof value === 'string' && te(`tow.reasons.${value}`)) return t(`tow.reasons.${value}`)
  if (key === 'kind' && typeof value === 'string' && te(`lifecycle.holds.${value}`)) return t(`lifecycle.holds.${value}`)
  const coded = typeof value === 'string' && CODED_VALUES[key] ? `${CODED_VALUES[key]}.${value}` : null
  if (coded && te(coded)) return t(coded)
  if (typeof value === 'string' && /^\d{4}-\d{2}-\d{2}T/.test(value)) return at(value)
  // A list of names (property handed back) reads as the names; a list of records as how many.
  if (Array.isArray(value)) return value.length > 0 && value.every((v) => typeof v === 'string') ? value.join(', ') : `${value.length}`
  return String(value)
}

export const shownKeys = (record: Record<string, unknown> | null) => Object.keys(record ?? {}).filter((k) => !HIDDEN.has(k) && k !== 'files')

export const stateLabel = (s: string | null) => (s ? (te(`lifecycle.columns.${s}`) ? t(`lifecycle.columns.${s}`) : s) : '')
