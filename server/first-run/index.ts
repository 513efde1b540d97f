export { firstRunRouter } from './first-run.routes'
