export { sessionRouter } from './session.routes'
export { knownDevices } from './known-devices'
export { pruneSignInFailures, signInThrottle, type SignInLimits } from './sign-in-throttle'
export { DatabaseSessionStore, endSessionsOf, pruneExpiredSessions } from './session-store'
