export { gateRouter, releasesRouter, type ReleaseDeps } from './releases.routes'
export { signatureImage } from './signature'
