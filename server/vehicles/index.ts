export { vehiclesRouter } from './vehicles.routes'
export { vehicleForUser, bumpVersion } from './vehicles.queries'
export type { VehicleRow } from './vehicles.queries'
export { holdsOf, spaceOf } from './vehicle-page.queries'
