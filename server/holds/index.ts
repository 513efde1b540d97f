export { holdsRouter } from './holds.routes'
export { setHold } from './holds.service'
