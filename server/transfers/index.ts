export { transfersRouter } from './transfers.routes'
