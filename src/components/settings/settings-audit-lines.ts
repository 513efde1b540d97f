import type { SettingsChange } from '@shared/schemas/settings-audit'
import { i18n } from '@/i18n'
import { money, number } from '@/composables/money'

/** One changed value as a person reads it: "Car — daily rate", "$65.00", "$70.00". */
export interface AuditLine {
  path: string
  label: string
  before: string | null
  after: string | null
}

const t = (key: string, params: Record<string, unknown> = {}) => i18n.global.t(key, params)
const has = (key: string) => i18n.global.te(key)

/** "maxStorageCents" → "max storage cents": a key the catalog has no words for still reads as words. */
const spaced = (key: string) => key.replace(/([a-z])([A-Z])/g, '$1 $2').toLowerCase()
const field = (key: string) => (has(`settings.audit.fields.${key}`) ? t(`settings.audit.fields.${key}`) : spaced(key))

/**
 * A changed value's path ("vehicleClasses.0.dailyRateCents") in words ("Car — daily rate"): a list item
 * by the name it had (`names`), else by its list and place ("Fee 2"), every other part by the catalog.
 */
export function pathLabel(path: string, names: Record<string, string>): string {
  const parts = path.split('.')
  const words: string[] = []
  for (let i = 0; i < parts.length; i++) {
    const part = parts[i]!
    const next = parts[i + 1]
    if (next !== undefined && /^\d+$/.test(next)) {
      const prefix = parts.slice(0, i + 2).join('.')
      words.push(names[prefix] ?? t('settings.audit.item', { list: field(part), n: Number(next) + 1 }))
      i++
    } else words.push(field(part))
  }
  return words.join(' — ')
}

/** A value in the reader's language: cents as money, a sample flag in words, yes and no, numbers. */
export function valueText(path: string, value: unknown): string {
  const key = path.split('.').at(-1) ?? ''
  if (value === null || value === undefined) return '—'
  if (typeof value === 'number') return key.endsWith('Cents') ? money(value) : number(value)
  if (typeof value === 'boolean') {
    if (key === 'placeholder') return t(value ? 'settings.audit.sample' : 'settings.audit.ours')
    return t(value ? 'settings.audit.yes' : 'settings.audit.no')
  }
  if (typeof value === 'string') return value
  if (Array.isArray(value) && value.every((v) => typeof v !== 'object')) return value.join(', ')
  return Object.entries(value as Record<string, unknown>)
    .map(([k, v]) => `${field(k)}: ${valueText(k, v)}`)
    .join('; ')
}

/** Every path either side of a change, once, in the order the rule set has them, each with before → after. */
export function auditLines(change: Pick<SettingsChange, 'before' | 'after' | 'names'>): AuditLine[] {
  const before = change.before ?? {}
  const after = change.after ?? {}
  const paths = [...new Set([...Object.keys(before), ...Object.keys(after)])]
  return paths.map((path) => ({
    path,
    label: pathLabel(path, change.names),
    before: path in before ? valueText(path, before[path]) : null,
    after: path in after ? valueText(path, after[path]) : null,
  }))
}
