export { healthRouter } from './health.routes'
export { Drain } from './drain'
export { readinessCheck, type Readiness } from './readiness'
