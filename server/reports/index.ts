export { reportsRouter } from './reports.routes'
