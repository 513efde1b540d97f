export { glanceRouter } from './glance.routes'
