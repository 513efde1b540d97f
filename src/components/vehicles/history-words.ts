import { i18n } from '@/i18n'
import { money } from '@/composables/money'
import { INSPECTION_HIDDEN, inspectionFieldLabel, inspectionValue } from '@/components/inspections/inspection-history-words'

// Plain words, in the reader's language, for the fields a history event names (vehicles.history.fields
// in the catalogs); anything unlisted shows its own name.
const { t, te } = i18n.global
// Record ids and digests (payments, contacts, notices, owner links): the chain keeps them; a person reads the words beside them.
const HIDDEN = new Set(['holdId', 'paymentId', 'adjustmentId', ...INSPECTION_HIDDEN, 'contactId', 'requestId', 'noticeId', 'sendingId', 'fileId', 'linkId', 'outboxMessageId', 'sha256'])
// Codes a notice or contact event carries, with their words in shared/messages/<locale>/notices.json.
const NOTICE_CODES: Record<string, string> = { role: 'roles', source: 'sources', method: 'methods', outcome: 'outcomes' }

// Fields whose words have moved to the message catalogs (read at render, so they follow the language).
const CATALOG_LABELS: Record<string, string> = {
  estimatedValueSource: 'clocks.value.historySource',
  person: 'police.fields.person',
  notifiedAt: 'police.fields.notifiedAt',
  reportNumber: 'police.fields.reportNumber',
}

export function fieldLabel(key: string): string {
  const catalogKey = CATALOG_LABELS[key]
  if (catalogKey) return t(catalogKey)
  if (te(`vehicles.history.fields.${key}`)) return t(`vehicles.history.fields.${key}`)
  if (te(`billing.history.${key}`)) return t(`billing.history.${key}`)
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
  if (key.endsWith('Cents') && typeof value === 'number') return money(value)
  if (key === 'method' && typeof value === 'string' && te(`billing.methods.${value}`)) return t(`billing.methods.${value}`)
  if (key === 'kind' && typeof value === 'string' && te(`billing.adjustments.kinds.${value}`)) return t(`billing.adjustments.kinds.${value}`)
  if (key === 'reason' && typeof value === 'string' && te(`tow.reasons.${value}`)) return t(`tow.reasons.${value}`)
  if (key === 'kind' && typeof value === 'string' && te(`lifecycle.holds.${value}`)) return t(`lifecycle.holds.${value}`)
  if (key === 'kind' && typeof value === 'string' && te(`notices.kinds.${value}`)) return t(`notices.kinds.${value}`)
  if (NOTICE_CODES[key] && typeof value === 'string' && te(`notices.${NOTICE_CODES[key]}.${value}`)) return t(`notices.${NOTICE_CODES[key]}.${value}`)
  if (key === 'language' && (value === 'en' || value === 'es')) return t(`contacts.languages.${value}`)
  const coded = typeof value === 'string' && CODED_VALUES[key] ? `${CODED_VALUES[key]}.${value}` : null
  if (coded && te(coded)) return t(coded)
  if (typeof value === 'string' && /^\d{4}-\d{2}-\d{2}T/.test(value)) return at(value)
  // A list of names (property handed back) reads as the names; a list of records as how many.
  if (Array.isArray(value)) return value.length > 0 && value.every((v) => typeof v === 'string') ? value.join(', ') : `${value.length}`
  return String(value)
}

export const shownKeys = (record: Record<string, unknown> | null) => Object.keys(record ?? {}).filter((k) => !HIDDEN.has(k) && k !== 'files')

export const stateLabel = (s: string | null) => (s ? (te(`lifecycle.columns.${s}`) ? t(`lifecycle.columns.${s}`) : s) : '')
