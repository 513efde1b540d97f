import { useMutation, useQuery } from '@tanstack/vue-query'
import type { MoveRequest } from '@shared/schemas/moves'
import { request } from './http'
import { queryClient } from './query-client'

// The router brings this file into every page's first load, the sign-in page's too; the board's
// schemas stay in the board's own code and are imported when first needed (the board page has them).
const boardSchemas = () => import('@shared/schemas/board')

/**
 * The board's cache keys. Its data is also patched in place, never refetched, by the live stream and
 * by optimistic moves (src/composables/board-cache.ts, board-live.ts, board-moves.ts).
 */
export const boardKeys = {
  all: ['board'] as const,
}

export const fetchBoard = () => request('GET', '/api/board', boardSchemas().then((s) => s.boardBodySchema))

const boardQuery = { queryKey: boardKeys.all, queryFn: fetchBoard }

/** Starts loading the board while the board page's own code is still on its way. */
export const prefetchBoard = () => void queryClient.prefetchQuery(boardQuery)

/**
 * The board. Live events keep cards current; the slow refetch catches balances and days moving with
 * the clock. Shallow: 2,000 cards are replaced whole when they change, never edited in place, so deep
 * reactivity is only cost.
 */
export const useBoardQuery = () => useQuery({ ...boardQuery, refetchInterval: 5 * 60_000, shallow: true })

/** The updated card; a refused move throws ApiError (403/422 with `reasons`, 409 with `current`). */
export async function moveVehicle(id: string, move: MoveRequest) {
  const { moveRequestSchema } = await import('@shared/schemas/moves')
  return request('POST', `/api/vehicles/${encodeURIComponent(id)}/moves`, boardSchemas().then((s) => s.boardCardSchema), moveRequestSchema.parse(move))
}

/**
 * A board move. It invalidates nothing: the caller shows the card in its new column at once and puts
 * the answer (or the card as it was, if refused) into the board's cache (useBoardMoves), and every
 * other board hears of it on the live stream.
 */
export const useMoveVehicleMutation = () => useMutation({ mutationFn: ({ id, move }: { id: string; move: MoveRequest }) => moveVehicle(id, move) })

export const BOARD_EVENTS_URL = '/api/board/events'
