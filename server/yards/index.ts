export { yardsRouter } from './yards.routes'
export { yardOfStaff, yardOfUser, yardsOfUser } from './yards.queries'
export { createYard } from './yards.service'
