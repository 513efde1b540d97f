import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest'
import { BoardFeed, FLUSH_MS } from '../../../server/board/board-feed'

const removed = (n: number) => ({ type: 'removed' as const, id: `00000000-0000-4000-8000-${String(n).padStart(12, '0')}` })

describe('BoardFeed', () => {
  it('since_aBoardThatSawTheThirdEvent_getsTheFourthAndFifth', () => {
    const feed = new BoardFeed('srv1')
    for (let i = 1; i <= 5; i++) feed.push(removed(i))
    expect(feed.since('srv1.3')!.map((m) => m.id)).toEqual(['srv1.4', 'srv1.5'])
    expect(feed.since('srv1.5')).toEqual([])
  })

  it.each([
    { id: 'other.3', why: 'another server or an earlier run' },
    { id: 'srv1.9', why: 'an event this server never sent' },
    { id: 'srv1.x', why: 'not an event id' },
    { id: 'srv1.1', why: 'older than the events kept' },
  ])('since_$why_cannotBeReplayed', ({ id }) => {
    const feed = new BoardFeed('srv1', 3)
    for (let i = 1; i <= 5; i++) feed.push(removed(i))
    expect(feed.since(id)).toBeNull()
  })

  describe('delivery', () => {
    beforeEach(() => vi.useFakeTimers())
    afterEach(() => vi.useRealTimers())
    const board = () => {
      const got: string[] = []
      return { got, client: { write: (chunk: Buffer | string) => got.push(String(chunk)), end: () => undefined } }
    }
    const sse = (n: number) => `id: srv1.${n}\ndata: ${JSON.stringify(removed(n))}\n\n`

    it('push_twoEventsWithinTheWindow_reachEveryBoardAsOneWriteInOrder', () => {
      const feed = new BoardFeed('srv1')
      const [a, b] = [board(), board()]
      feed.clients.add(a.client)
      feed.clients.add(b.client)
      feed.push(removed(1))
      feed.push(removed(2))
      expect(a.got).toEqual([])
      vi.advanceTimersByTime(FLUSH_MS)
      expect(a.got).toEqual([sse(1) + sse(2)])
      expect(b.got).toEqual(a.got)
      expect(feed.lastId).toBe('srv1.2')
    })

    it('push_anEventAfterTheWindow_goesOutInANewWrite', () => {
      const feed = new BoardFeed('srv1')
      const a = board()
      feed.clients.add(a.client)
      feed.push(removed(1))
      vi.advanceTimersByTime(FLUSH_MS)
      feed.push(removed(2))
      vi.advanceTimersByTime(FLUSH_MS)
      expect(a.got).toEqual([sse(1), sse(2)])
    })

    it('add_whileEventsGather_theNewBoardHearsEachEventOnce', () => {
      const feed = new BoardFeed('srv1')
      const [early, late] = [board(), board()]
      feed.clients.add(early.client)
      feed.push(removed(1))
      feed.push(removed(2))
      // The late board last saw event 1 (its GET /api/board, say): it is owed event 2 only.
      feed.add(late.client, 'srv1.1')
      feed.push(removed(3))
      vi.advanceTimersByTime(FLUSH_MS)
      expect(early.got).toEqual([sse(1) + sse(2), sse(3)])
      expect(late.got).toEqual([sse(2), sse(3)])
    })

    it('add_anIdThatCannotBeReplayed_toldToStartOver', () => {
      const feed = new BoardFeed('srv1')
      const a = board()
      feed.push(removed(1))
      feed.add(a.client, 'other.1')
      expect(a.got).toEqual([`id: srv1.1\ndata: {"type":"resync"}\n\n`])
    })
  })
})
