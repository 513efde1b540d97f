export { boardRouter } from './board.routes'
