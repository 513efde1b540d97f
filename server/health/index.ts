export { healthRouter } from './health.routes'
