import { onBeforeUnmount, ref, watch, type Ref } from 'vue'
import { boardEventSchema } from '@shared/schemas/board'
import { BOARD_EVENTS_URL } from '@/api/board'
import { useSessionStore } from '@/stores/session'
import { useBoardCache } from './board-cache'

export type LiveStatus = 'connecting' | 'live' | 'reconnecting'

// When the server answers the stream with an error (signed out, restarting), EventSource gives up;
// the board tries again after this long, resuming from the last event it saw.
const REOPEN_MS = 5_000

/**
 * Keeps the board query's data current from GET /api/board/events: cards are patched in place as
 * others move them, tow them in, hold or pay; a gap the server cannot replay refetches the board.
 */
export function useBoardLive(boardEventId: Ref<string | undefined>) {
  const cache = useBoardCache()
  const session = useSessionStore()
  const status = ref<LiveStatus>('connecting')
  let source: EventSource | null = null
  let lastId: string | undefined
  let reopen: ReturnType<typeof setTimeout> | undefined
  let stopped = false

  function open() {
    source = new EventSource(`${BOARD_EVENTS_URL}?since=${encodeURIComponent(lastId ?? '')}`)
    source.onopen = () => (status.value = 'live')
    source.onmessage = (e) => {
      if (e.lastEventId) lastId = e.lastEventId
      apply(e.data)
    }
    source.onerror = () => {
      status.value = 'reconnecting'
      if (source?.readyState !== EventSource.CLOSED || stopped) return
      // A stream the server refused may mean the session ended: then the page asks to sign in again.
      void session.check().catch(() => undefined)
      reopen = setTimeout(open, REOPEN_MS)
    }
  }

  function apply(data: string) {
    const parsed = boardEventSchema.safeParse(JSON.parse(data))
    if (!parsed.success) return
    const event = parsed.data
    if (event.type === 'resync') void cache.refetch()
    else if (event.type === 'removed') cache.remove(event.id)
    else {
      const known = cache.find(event.card.id)
      // An answer to this board's own move may already have put this or a newer version in.
      if (known && (known.version > event.card.version || JSON.stringify(known) === JSON.stringify(event.card))) return
      cache.put(event.card)
    }
  }

  const stopWatching = watch(
    boardEventId,
    (id) => {
      if (source || !id) return
      lastId = id
      open()
    },
    { immediate: true },
  )

  onBeforeUnmount(() => {
    stopped = true
    stopWatching()
    clearTimeout(reopen)
    source?.close()
  })
  return { status }
}
