export { gateRouter, releasesRouter, type ReleaseDeps } from './releases.routes'
export { ownerRelease, signReleaseAsOwner } from './owner-signature.service'
export { signatureImage } from './signature'
