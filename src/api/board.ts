import { boardCardSchema, boardSchema } from '@shared/schemas/board'
import { moveRequestSchema, type MoveRequest } from '@shared/schemas/moves'
import { request } from './http'
import { queryClient } from './query-client'

export const BOARD_KEY = ['board'] as const

export const fetchBoard = () => request('GET', '/api/board', boardSchema)

/** Starts loading the board while the board page's own code is still on its way. */
export const prefetchBoard = () => void queryClient.prefetchQuery({ queryKey: BOARD_KEY, queryFn: fetchBoard })

/** The updated card; a refused move throws ApiError (403/422 with `reasons`, 409 with `current`). */
export const moveVehicle = (id: string, move: MoveRequest) =>
  request('POST', `/api/vehicles/${encodeURIComponent(id)}/moves`, boardCardSchema, moveRequestSchema.parse(move))

export const BOARD_EVENTS_URL = '/api/board/events'
