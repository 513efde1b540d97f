export { inspectionsRouter } from './inspections.routes'
export { inspectionOf } from './inspection-page'
