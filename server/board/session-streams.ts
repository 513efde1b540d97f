import type { SessionsEnded } from '../live/index'

/** Whose a stream is: the session (by `sessionKey`, never the id) and its user. */
export interface StreamOwner {
  sessionKey: string
  userId: string
}

/** How many live board streams one sign-in may hold open on one app server. */
export const STREAMS_PER_SESSION = 5

/**
 * The open board streams of this app server by session, so that a session's end (heard on the
 * live bus from whichever server saw it) ends them at once, and one session cannot hold more
 * than a few: a browser has a tab or two open, not a thousand.
 */
export class SessionStreams {
  private readonly bySession = new Map<string, Set<{ owner: StreamOwner; end: () => void }>>()

  constructor(private readonly perSession = STREAMS_PER_SESSION) {}

  /** Registers a stream; null when its session already has as many as it may. Returns its release. */
  add(owner: StreamOwner, end: () => void): (() => void) | null {
    let streams = this.bySession.get(owner.sessionKey)
    if ((streams?.size ?? 0) >= this.perSession) return null
    if (!streams) this.bySession.set(owner.sessionKey, (streams = new Set()))
    const entry = { owner, end }
    streams.add(entry)
    return () => {
      streams.delete(entry)
      if (streams.size === 0 && this.bySession.get(owner.sessionKey) === streams) this.bySession.delete(owner.sessionKey)
    }
  }

  end(ended: SessionsEnded): void {
    const matching = 'sessionKey' in ended ? [...(this.bySession.get(ended.sessionKey) ?? [])] : [...this.bySession.values()].flatMap((s) => [...s].filter((e) => e.owner.userId === ended.userId))
    for (const e of matching) e.end()
  }
}
