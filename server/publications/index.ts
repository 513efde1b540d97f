export { publicationsRouter, saleDateRouter } from './publications.routes'
