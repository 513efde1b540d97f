export { sessionRouter, type SignInLimits } from './session.routes'
export { DatabaseSessionStore, endSessionsOf, pruneExpiredSessions } from './session-store'
export { sessionSecret } from './secret'
export { renameInSessions } from './session-store'
