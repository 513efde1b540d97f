import { i18n } from '@/i18n'

/**
 * Why the camera did not start, in words for the person holding the phone (in the chosen language).
 * Browsers give a camera only to a secure page (HTTPS, or this computer itself), and name their
 * refusals as DOMExceptions.
 */
export function cameraProblem(error: unknown, secure: boolean): string {
  const { t } = i18n.global
  const typeIt = t('vehicles.camera.typeIt')
  if (!secure) return t('vehicles.camera.insecure', { typeIt })
  const name = error instanceof Error ? error.name : ''
  switch (name) {
    case 'NotAllowedError':
    case 'SecurityError':
      return t('vehicles.camera.notAllowed')
    case 'NotFoundError':
    case 'OverconstrainedError':
      return t('vehicles.camera.notFound', { typeIt })
    case 'NotReadableError':
    case 'AbortError':
      return t('vehicles.camera.busy')
    default:
      if (error === undefined) return t('vehicles.camera.noCamera', { typeIt })
      return error instanceof Error && error.message ? t('vehicles.camera.failedWhy', { why: error.message, typeIt }) : t('vehicles.camera.failed', { typeIt })
  }
}
