export { vehiclesRouter } from './vehicles.routes'
export { vehicleForUser, bumpVersion } from './vehicles.queries'
