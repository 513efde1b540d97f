export { inspectionsRouter } from './inspections.routes'
