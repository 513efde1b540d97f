export { transfersRouter } from './transfers.routes'
export { recordTransfer, signTransfer } from './transfers.service'
