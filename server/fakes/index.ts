export { fakesRouter } from './fakes.routes'
