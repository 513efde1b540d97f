export { deadlinesRouter } from './deadlines.routes'
