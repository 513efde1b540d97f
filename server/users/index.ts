export { usersRouter } from './users.routes'
export { hashPassword, verifyPassword } from './passwords'
export { companyOf, findUserByEmail, insertUser } from './users.queries'
