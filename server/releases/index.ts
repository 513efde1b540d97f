export { gateRouter, releasesRouter, type ReleaseDeps } from './releases.routes'
export { addIdPhoto, recordClaimant, recordHandover, signRelease } from './releases.service'
export { issueGatePass, recordOut } from './gate-passes.service'
