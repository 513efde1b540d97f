export { boardRouter } from './board.routes'
export { BoardHub } from './board-hub'
export { movesRouter } from './moves.routes'
