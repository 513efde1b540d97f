export { publicationsRouter } from './publications.routes'
