export { deadlinesRouter } from './deadlines.routes'
export { yardDeadlines } from './deadlines.service'
export { activeVehicles } from './deadlines.queries'
