export { holdsRouter } from './holds.routes'
