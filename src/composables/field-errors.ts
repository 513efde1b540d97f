import { reactive } from 'vue'
import type { z } from 'zod'
import { ApiError } from '@/api/http'

/**
 * Per-field messages from the shared zod schema (checked before sending) or from the server's 400
 * answer (`issues[].path`), so the message shows beside the field either way.
 */
export function useFieldErrors() {
  const errors = reactive<Record<string, string>>({})

  function clear() {
    for (const key of Object.keys(errors)) delete errors[key]
  }

  function fromZod(error: z.ZodError) {
    clear()
    for (const issue of error.issues) errors[issue.path.join('.')] ??= issue.message
  }

  /** Returns true when the error was about fields and is now shown beside them. */
  function fromApi(error: unknown): boolean {
    clear()
    if (!(error instanceof ApiError) || error.issues.length === 0) return false
    for (const issue of error.issues) errors[issue.path] ??= issue.message
    return true
  }

  return { errors, clear, fromZod, fromApi }
}
