export { spacesRouter, vehicleSpaceRouter } from './spaces.routes'
