export { usersRouter } from './users.routes'
export { hashPassword, verifyPassword } from './passwords'
