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
