export { boardRouter } from './board.routes'
export { BoardHub, type BoardHubOptions } from './board-hub'
export { movesRouter } from './moves.routes'
