import { describe, expect, it } from 'vitest'
import { BoardFeed, type FeedMessage } from '../../../server/board/board-feed'

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

  it('push_sendsEachEventToEveryClientWithItsId', () => {
    const feed = new BoardFeed('srv1')
    const got: FeedMessage[] = []
    feed.clients.add({ send: (m) => got.push(m), end: () => undefined })
    feed.push(removed(1))
    expect(got).toEqual([{ id: 'srv1.1', data: JSON.stringify(removed(1)) }])
    expect(feed.lastId).toBe('srv1.1')
  })
})
