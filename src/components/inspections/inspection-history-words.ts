import { checklistItem } from '@shared/domain/inspection'
import { money } from '@/composables/money'
import { i18n } from '@/i18n'

// Plain words, in the reader's language, for what the teardown's history entries record (server/inspections).
const { t, te } = i18n.global

export const INSPECTION_HIDDEN = ['inspectionId', 'lineId', 'previousInspectionId', 'name']

/** A teardown field's name (inspections.history.fields in the catalogs), or undefined when it is not the teardown's. */
export function inspectionFieldLabel(key: string): string | undefined {
  return te(`inspections.history.fields.${key}`) ? t(`inspections.history.fields.${key}`) : undefined
}

/** "Ball joints (Suspension and steering)", in the reader's language. */
export function itemWords(code: string): string {
  const item = checklistItem(code)
  if (!item) return code
  return t('inspection.itemName', { item: t(`inspection.items.${code}.label`), system: t(`inspection.systems.${item.system.code}`) })
}

/** The teardown's own way of showing a value, or undefined to leave it to the general rules. */
export function inspectionValue(key: string, value: unknown): string | undefined {
  if (key.endsWith('Cents') && typeof value === 'number') return money(value)
  if (key === 'status' && typeof value === 'string' && te(`inspection.findings.${value}`)) return t(`inspection.findings.${value}`)
  if (key === 'item' && typeof value === 'string') return itemWords(value)
  if ((key === 'broken' || key === 'worn') && Array.isArray(value)) return value.map((v) => itemWords(String(v))).join(', ') || '—'
  return undefined
}
