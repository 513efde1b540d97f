export { yardsRouter } from './yards.routes'
export { yardOfUser } from './yards.queries'
export { createYard } from './yards.service'
