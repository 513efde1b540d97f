export { gateRouter, releasesRouter, type ReleaseDeps } from './releases.routes'
