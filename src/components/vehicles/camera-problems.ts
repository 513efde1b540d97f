const TYPE_IT = 'Type the VIN instead.'

/**
 * Why the camera did not start, in words for the person holding the phone. Browsers give a camera
 * only to a secure page (HTTPS, or this computer itself), and name their refusals as DOMExceptions.
 */
export function cameraProblem(error: unknown, secure: boolean): string {
  if (!secure) {
    return `The camera works only when Holdfast is opened over HTTPS: ask whoever runs it to serve it that way. ${TYPE_IT}`
  }
  const name = error instanceof Error ? error.name : ''
  switch (name) {
    case 'NotAllowedError':
    case 'SecurityError':
      return `Holdfast was not allowed to use the camera. Allow the camera for this site in the browser’s settings and try again, or type the VIN.`
    case 'NotFoundError':
    case 'OverconstrainedError':
      return `No camera was found on this device. ${TYPE_IT}`
    case 'NotReadableError':
    case 'AbortError':
      return `The camera is busy or could not be started: close any other app using it and try again, or type the VIN.`
    default:
      return error === undefined
        ? `This browser cannot use a camera here. ${TYPE_IT}`
        : `The camera could not be started${error instanceof Error && error.message ? ` (${error.message})` : ''}. ${TYPE_IT}`
  }
}
