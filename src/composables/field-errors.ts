import { reactive, watch, type WatchStopHandle } from 'vue'
import type { z } from 'zod'
import { ApiError } from '@/api/http'
import { fieldText } from './field-words'

/** The value at a dotted path of an issue ("tow.reason", "lines.0.hours"). */
function valueAt(draft: unknown, path: string): string {
  let value = draft
  for (const key of path.split('.')) value = value == null ? undefined : (value as Record<string, unknown>)[key]
  return JSON.stringify(value) ?? ''
}

/**
 * Per-field messages from the shared zod schema (checked before sending) or from the server's 400
 * answer (`issues[].path`), so the message shows beside the field either way, in the reader's
 * language (`fieldText`; the server's are rendered as they arrive, in src/api/http.ts). Once a form follows
 * its draft (`follow`), a message goes as soon as its field is right: the schema's at once, the
 * server's when the field is changed (only the server can say it is right).
 */
export function useFieldErrors() {
  const errors = reactive<Record<string, string>>({})
  // For the server's messages: the field's value when it was refused.
  const refused = new Map<string, string>()
  let followed: { source: () => unknown; schema: z.ZodType } | null = null
  let stop: WatchStopHandle | null = null

  function clear() {
    for (const key of Object.keys(errors)) delete errors[key]
    refused.clear()
  }

  function fromZod(error: z.ZodError) {
    clear()
    // Only the message: a zod issue's own `code` (too_small, custom…) is not one of the catalog's.
    for (const issue of error.issues) errors[issue.path.join('.')] ??= fieldText({ message: issue.message })
  }

  /** Returns true when the error was about fields and is now shown beside them. */
  function fromApi(error: unknown): boolean {
    clear()
    if (!(error instanceof ApiError) || error.issues.length === 0) return false
    const draft = followed?.source()
    for (const issue of error.issues) {
      // Rendered again: its words may have loaded since the answer came (the sign-in page loads them late).
      errors[issue.path] ??= fieldText(issue)
      if (followed) refused.set(issue.path, valueAt(draft, issue.path))
    }
    return true
  }

  function recheck() {
    if (!followed || Object.keys(errors).length === 0) return
    const draft = followed.source()
    const parsed = followed.schema.safeParse(draft)
    const stillWrong = new Set(parsed.success ? [] : parsed.error.issues.map((i) => i.path.join('.')))
    for (const key of Object.keys(errors)) {
      const fromServer = refused.get(key)
      const fixed = fromServer === undefined ? !stillWrong.has(key) : valueAt(draft, key) !== fromServer
      if (fixed) {
        delete errors[key]
        refused.delete(key)
      }
    }
  }

  /** Keeps the messages true to the draft as it is edited (a deep watch; stops with the component). */
  function follow(source: () => unknown, schema: z.ZodType) {
    followed = { source, schema }
    stop?.()
    stop = watch(source, recheck, { deep: true })
  }

  return { errors, clear, fromZod, fromApi, follow }
}
