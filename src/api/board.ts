import { boardCardSchema, boardSchema } from '@shared/schemas/board'
import { moveRequestSchema, type MoveRequest } from '@shared/schemas/moves'
import { request } from './http'

export const fetchBoard = () => request('GET', '/api/board', boardSchema)

/** The updated card; a refused move throws ApiError (403/422 with `reasons`, 409 with `current`). */
export const moveVehicle = (id: string, move: MoveRequest) =>
  request('POST', `/api/vehicles/${encodeURIComponent(id)}/moves`, boardCardSchema, moveRequestSchema.parse(move))

export const BOARD_EVENTS_URL = '/api/board/events'
