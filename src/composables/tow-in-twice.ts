import { ElMessageBox } from 'element-plus'
import { useI18n } from 'vue-i18n'
import { useRouter } from 'vue-router'
import { duplicateTowInSchema } from '@shared/schemas/tow-in'
import { ApiError } from '@/api/http'

/**
 * A tow-in the server refused because a vehicle with the same VIN or plate is still in the yard (409
 * with `duplicates`): the dispatcher opens that vehicle, or says why this is a separate tow-in and
 * logs it with that reason. Any other error is not this composable's.
 */
export function useTowInTwice() {
  const { t } = useI18n()
  const router = useRouter()

  /** The dispatcher's reason to log it anyway; null when they chose to open the other vehicle, or to stay. */
  async function askWhy(error: unknown): Promise<string | null | undefined> {
    if (!(error instanceof ApiError) || error.status !== 409) return undefined
    const parsed = duplicateTowInSchema.safeParse(error.body)
    if (!parsed.success) return undefined
    const first = parsed.data.duplicates[0]!
    try {
      const { value } = await ElMessageBox.prompt(error.message, t('towInTwice.title'), {
        confirmButtonText: t('towInTwice.logAnyway'),
        cancelButtonText: t('towInTwice.open', { stock: first.stockNumber }),
        distinguishCancelAndClose: true,
        inputPlaceholder: t('towInTwice.reasonPlaceholder'),
        inputValidator: (v) => (v?.trim().length ?? 0) >= 3 || t('towInTwice.reasonNeeded'),
        type: 'warning',
      })
      return value.trim()
    } catch (action) {
      if (action === 'cancel') await router.push(`/vehicles/${first.id}`)
      return null
    }
  }

  return { askWhy }
}
