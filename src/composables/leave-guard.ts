import { ElMessageBox } from 'element-plus'
import { onBeforeUnmount, onMounted } from 'vue'
import { onBeforeRouteLeave } from 'vue-router'
import { i18n } from '@/i18n'
import { useSessionStore } from '@/stores/session'

/**
 * The question is in the reader's words already (catalog texts).
 * Asks before a page with unsaved work is left: within the app with a question of our own, on a reload
 * or a closed tab with the browser's (the only one a page may ask then).
 */
export function useLeaveGuard(unsaved: () => boolean, question: { title: string; message: string }) {
  const session = useSessionStore()

  onBeforeRouteLeave(() => {
    // Once the session has ended the work cannot be saved here any more: staying would only strand it.
    if (!unsaved() || !session.signedIn) return true
    return ElMessageBox.confirm(question.message, question.title, {
      type: 'warning',
      confirmButtonText: i18n.global.t('common.leaveAnyway'),
      cancelButtonText: i18n.global.t('common.stay'),
    }).then(
      () => true,
      () => false,
    )
  })

  const beforeUnload = (e: BeforeUnloadEvent) => {
    if (unsaved()) e.preventDefault()
  }
  onMounted(() => window.addEventListener('beforeunload', beforeUnload))
  onBeforeUnmount(() => window.removeEventListener('beforeunload', beforeUnload))
}
