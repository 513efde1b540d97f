import { TOW_REASON_LABELS } from '@shared/domain/tow'
import type { FileKind } from '@shared/schemas/files'
import type { HistoryEvent } from '@shared/schemas/history'
import { i18n } from '@/i18n'
import { money } from '@/composables/money'
import { calendarDate } from '@/composables/yard-time'
import { INSPECTION_HIDDEN, inspectionFieldLabel, inspectionValue } from '@/components/inspections/inspection-history-words'

// Plain words, in the reader's language, for the fields a history event names (vehicles.history.fields
// in the catalogs); anything unlisted shows its own name.
const { t, te } = i18n.global
// Record ids and digests (payments, contacts, notices, owner links): the chain keeps them; a person reads the words beside them.
const HIDDEN = new Set(['holdId', 'paymentId', 'adjustmentId', ...INSPECTION_HIDDEN, 'contactId', 'requestId', 'noticeId', 'sendingId', 'fileId', 'linkId', 'outboxMessageId', 'sha256', 'passId', 'publicationId', 'proceedsPaymentId', 'refundOfPaymentId'])
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
  if (te(`historyWords.fields.${key}`)) return t(`historyWords.fields.${key}`)
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
  buyerKind: 'transfers.buyerKinds',
  signOverTo: 'transfers.buyerKinds',
  choice: 'owner.office.choice',
  event: 'publications.steps.events',
  recommendation: 'inspections.advice',
  failureReason: 'historyWords.refundFailures',
}

// A calendar day as the server counted it on the yard's clock ("2026-11-30"): in the one date look.
const DAY = /^\d{4}-\d{2}-\d{2}$/

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
  if (key === 'kind' && typeof value === 'string' && te(`transfers.kinds.${value}`)) return t(`transfers.kinds.${value}`)
  if (NOTICE_CODES[key] && typeof value === 'string' && te(`notices.${NOTICE_CODES[key]}.${value}`)) return t(`notices.${NOTICE_CODES[key]}.${value}`)
  if (key === 'vehicleClass' && typeof value === 'string' && te(`vehicle.classes.${value}`)) return t(`vehicle.classes.${value}`)
  if (key === 'language' && (value === 'en' || value === 'es')) return t(`contacts.languages.${value}`)
  const coded = typeof value === 'string' && CODED_VALUES[key] ? `${CODED_VALUES[key]}.${value}` : null
  if (coded && te(coded)) return t(coded)
  if (typeof value === 'string' && /^\d{4}-\d{2}-\d{2}T/.test(value)) return at(value)
  if (typeof value === 'string' && DAY.test(value)) return calendarDate(value)
  // A list of names (property handed back) or days reads as them; a list of records as how many.
  if (Array.isArray(value)) {
    if (value.length > 0 && value.every((v) => typeof v === 'string')) return value.map((v) => (DAY.test(v) ? calendarDate(v) : v)).join(', ')
    return `${value.length}`
  }
  // A record of figures (a sale's proceeds) reads as each figure's words.
  if (typeof value === 'object') return Object.entries(value as Record<string, unknown>).map(([k, v]) => `${fieldLabel(k)}: ${fieldValue(k, v, at)}`).join(' · ')
  return String(value)
}

export const shownKeys = (record: Record<string, unknown> | null) => Object.keys(record ?? {}).filter((k) => !HIDDEN.has(k) && k !== 'files')

export const stateLabel = (s: string | null) => (s ? (te(`lifecycle.columns.${s}`) ? t(`lifecycle.columns.${s}`) : s) : '')

export const kindLabel = (kind: string) => (te(`history.kinds.${kind}`) ? t(`history.kinds.${kind}`) : kind)

// A tow-in records the reason's English label (older records its code, spaced): either reads in the reader's words.
// A closing whose reason is only its disposition's code in words ("returned to owner") reads as the disposition.
export function reasonWords(e: Pick<HistoryEvent, 'kind' | 'reason' | 'after'>): string | null {
  const towReason = Object.entries(TOW_REASON_LABELS).find(([, label]) => label === e.reason)?.[0] ?? e.reason?.replaceAll(' ', '_')
  if (e.kind === 'towed_in' && towReason && te(`tow.reasons.${towReason}`)) return t(`tow.reasons.${towReason}`)
  const disposition = typeof e.after?.disposition === 'string' ? e.after.disposition : null
  if (disposition && e.reason === disposition.replaceAll('_', ' ') && te(`lifecycle.dispositions.${disposition}`)) return t(`lifecycle.dispositions.${disposition}`)
  return e.reason
}

type HistoryFile = { kind: FileKind; label: string | null; sha256: string }
export const historyFiles = (e: Pick<HistoryEvent, 'after'>) => (e.after?.files as HistoryFile[] | undefined) ?? []

/**
 * Everything a person reads of one history entry, in the reader's language (what VehiclesHistory shows):
 * its title, the move, the reason, each changed field's name with its value before and after, the files.
 * `value` words one field's value (the page passes one that knows the vehicle's class label).
 */
export function historyWords(e: HistoryEvent, value: (key: string, v: unknown) => string) {
  const keys = [...new Set([...shownKeys(e.before), ...shownKeys(e.after)])]
  return {
    title: kindLabel(e.kind),
    move: e.fromState || e.toState ? `${stateLabel(e.fromState)}${e.fromState ? ' → ' : ''}${stateLabel(e.toState)}` : '',
    reason: e.reason ? reasonWords(e) : null,
    rows: keys.map((k) => ({ key: k, label: fieldLabel(k), before: e.before ? value(k, e.before[k]) : null, after: e.after ? value(k, e.after[k]) : null })),
    files: historyFiles(e).map((f) => ({ sha256: f.sha256, name: f.label ?? t(`vehicle.fileKinds.${f.kind}`) })),
  }
}
