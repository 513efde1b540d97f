export { spacesRouter, vehicleSpaceRouter } from './spaces.routes'
export { freeSpace, isSpaceConflict, spaceTaken } from './spaces.queries'
