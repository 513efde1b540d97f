import type { MoveRequest } from '@shared/schemas/moves'
import { request } from './http'
import { queryClient } from './query-client'

// The router brings this file into every page's first load, the sign-in page's too; the board's
// schemas stay in the board's own code and are imported when first needed (the board page has them).
const boardSchemas = () => import('@shared/schemas/board')

export const BOARD_KEY = ['board'] as const

export const fetchBoard = () => request('GET', '/api/board', boardSchemas().then((s) => s.boardSchema))

/** Starts loading the board while the board page's own code is still on its way. */
export const prefetchBoard = () => void queryClient.prefetchQuery({ queryKey: BOARD_KEY, queryFn: fetchBoard })

/** The updated card; a refused move throws ApiError (403/422 with `reasons`, 409 with `current`). */
export async function moveVehicle(id: string, move: MoveRequest) {
  const { moveRequestSchema } = await import('@shared/schemas/moves')
  return request('POST', `/api/vehicles/${encodeURIComponent(id)}/moves`, boardSchemas().then((s) => s.boardCardSchema), moveRequestSchema.parse(move))
}

export const BOARD_EVENTS_URL = '/api/board/events'
