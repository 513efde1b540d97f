export { csrfProtection } from './csrf'
export { currentUser } from './current-user'
export { refuseNulCharacters } from './no-nul'
export { newCsrfToken, sessionMiddleware } from './session'
