import { isReactive, ref } from 'vue'
import type { z } from 'zod'
import { i18n } from '@/i18n'
import { useFieldErrors } from './field-errors'

/**
 * Checks a form with its shared schema, sends it, and puts any refusal beside the fields (or in
 * `message` when it is not about one). Resolves true when the server accepted it.
 */
export function useFormSubmit<S extends z.ZodType>(schema: S, send: (input: z.output<S>) => Promise<unknown>) {
  const { errors, fromZod, fromApi, clear, follow } = useFieldErrors()
  const message = ref('')
  const busy = ref(false)

  async function submit(draft: unknown): Promise<boolean> {
    message.value = ''
    // A form handed in as a reactive object is followed: each message goes once its field is right.
    if (isReactive(draft)) follow(() => draft, schema)
    const parsed = schema.safeParse(draft)
    if (!parsed.success) {
      fromZod(parsed.error)
      return false
    }
    clear()
    busy.value = true
    try {
      await send(parsed.data)
      return true
    } catch (e) {
      // The refusal itself is already in the reader's language (src/api/http.ts renders its code).
      message.value = fromApi(e) ? i18n.global.t('common.notSaved.checkFields') : i18n.global.t('common.notSaved.why', { why: (e as Error).message })
      return false
    } finally {
      busy.value = false
    }
  }

  return { errors, message, busy, submit, clear }
}
