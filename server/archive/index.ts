export { archiveRouter } from './archive.routes'
