import { useQueryClient } from '@tanstack/vue-query'
import type { BoardColumn } from '@shared/domain/lifecycle'
import type { Board, BoardCard } from '@shared/schemas/board'
import { boardKeys } from '@/api/board'

const order = (c: BoardCard) => c.arrivedAt + c.stockNumber

/** The board with this card where its state says (oldest arrival first), wherever it was before. */
export function withCard(board: Board, card: BoardCard): Board {
  const columns = board.columns.map((col) => {
    const cards = col.cards.filter((c) => c.id !== card.id)
    if (col.column === card.state) {
      const at = cards.findIndex((c) => order(c) > order(card))
      cards.splice(at < 0 ? cards.length : at, 0, card)
    }
    return cards.length === col.cards.length && col.column !== card.state ? col : { ...col, cards }
  })
  return { ...board, columns }
}

export function withoutCard(board: Board, id: string): Board {
  return { ...board, columns: board.columns.map((col) => (col.cards.some((c) => c.id === id) ? { ...col, cards: col.cards.filter((c) => c.id !== id) } : col)) }
}

export function findCard(board: Board | undefined, id: string): BoardCard | undefined {
  for (const col of board?.columns ?? []) {
    const card = col.cards.find((c) => c.id === id)
    if (card) return card
  }
  return undefined
}

/** The board query's data (useBoardQuery), read and patched in place of a refetch. */
export function useBoardCache() {
  const client = useQueryClient()
  const get = () => client.getQueryData<Board>(boardKeys.all)
  const patch = (change: (b: Board) => Board) => client.setQueryData<Board>(boardKeys.all, (b) => (b ? change(b) : b))
  return {
    get,
    find: (id: string) => findCard(get(), id),
    /** A card as the server now has it: closed cards leave the board. */
    put: (card: BoardCard) => patch((b) => (card.state === 'closed' ? withoutCard(b, card.id) : withCard(b, card))),
    /** Shows the card in a new column before the server answers (the move is undone if refused). */
    place: (card: BoardCard, column: BoardColumn | 'closed') =>
      patch((b) => (column === 'closed' ? withoutCard(b, card.id) : withCard(b, { ...card, state: column }))),
    remove: (id: string) => patch((b) => withoutCard(b, id)),
    refetch: () => client.invalidateQueries({ queryKey: boardKeys.all }),
  }
}
