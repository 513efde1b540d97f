type Json = unknown

function isPlainObject(v: Json): v is Record<string, Json> {
  return typeof v === 'object' && v !== null && !Array.isArray(v)
}

/**
 * Only what differs between two settings values, each side keyed by its dotted path
 * ("vehicleClasses.0.dailyRateCents"): the audit shows what changed, not the whole rule set twice.
 * A value present on one side only appears on that side.
 */
export function changedValues(before: Json, after: Json): { before: Record<string, Json>; after: Record<string, Json> } {
  const out = { before: {} as Record<string, Json>, after: {} as Record<string, Json> }
  walk(before, after, '', out)
  return out
}

function walk(a: Json, b: Json, path: string, out: { before: Record<string, Json>; after: Record<string, Json> }) {
  const bothObjects = isPlainObject(a) && isPlainObject(b)
  const bothArrays = Array.isArray(a) && Array.isArray(b)
  if (bothObjects || bothArrays) {
    const keys = new Set([...Object.keys(a as object), ...Object.keys(b as object)])
    for (const key of keys) walk((a as Record<string, Json>)[key], (b as Record<string, Json>)[key], path ? `${path}.${key}` : key, out)
    return
  }
  if (JSON.stringify(a) === JSON.stringify(b)) return
  const key = path || '(value)'
  if (a !== undefined) out.before[key] = a
  if (b !== undefined) out.after[key] = b
}

/**
 * How a person names each list item a changed path points into — "vehicleClasses.0" → "Car" — read from
 * the item's `label` (or `name`) after the change, else before it: the audit can then say "Car — daily
 * rate" even when the label itself did not change. Items without a label are left out.
 */
export function itemNames(before: Json, after: Json, paths: readonly string[]): Record<string, string> {
  const names: Record<string, string> = {}
  for (const path of paths) {
    const parts = path.split('.')
    for (let i = 1; i < parts.length; i++) {
      if (!/^\d+$/.test(parts[i]!)) continue
      const prefix = parts.slice(0, i + 1).join('.')
      const item = at(after, parts.slice(0, i + 1)) ?? at(before, parts.slice(0, i + 1))
      const name = isPlainObject(item) ? (item.label ?? item.name) : undefined
      if (typeof name === 'string') names[prefix] = name
    }
  }
  return names
}

function at(value: Json, parts: readonly string[]): Json {
  let v = value
  for (const p of parts) v = isPlainObject(v) || Array.isArray(v) ? (v as Record<string, Json>)[p] : undefined
  return v
}
