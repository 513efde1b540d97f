import type { Database } from '@db/client'
import type { Role } from '@shared/domain/access'
import { NOTICE_EVENTS } from '@shared/domain/notices'
import { isoDate, localDay } from '@shared/domain/time'
import { DEADLINE_KINDS, type DeadlineEntry } from '@shared/schemas/deadlines'
import { TODAY_KINDS_BY_ROLE, TODAY_WHEN, type Today, type TodayItem, type TodayKind } from '@shared/schemas/today'
import { activeCards, boardYardOf } from '../board/index'
import { yardDeadlines } from '../deadlines/index'
import { dueNotices } from '../notices/index'

const WEEK_DAYS = 7
const DAY_MS = 86_400_000

type Who = Pick<TodayItem, 'vehicleId' | 'stockNumber' | 'vehicle' | 'plate'>
type When = TodayItem['when']

/**
 * The Today page of one person: what is due or overdue today and in the coming week for their role,
 * each line a vehicle and the work to do on it. It reads what the other pages already work out — the
 * board's cards (columns, holds, spaces, photos), the Deadlines page's list and the Outbox's "notices
 * due" — and only sorts them by role and day; it computes no clock of its own.
 */
export async function todayOf(db: Database, user: { id: string; role: Role }, asOf = new Date()): Promise<Today> {
  const yard = await boardYardOf(db, user.id)
  const todayNum = localDay(yard.timeZone, asOf.getTime())
  const today = isoDate(todayNum)
  const weekEnds = isoDate(todayNum + WEEK_DAYS - 1)
  const wanted = new Set<TodayKind>(TODAY_KINDS_BY_ROLE[user.role])
  const whenOf = (day: string | null): When | null => (day === null ? 'now' : day < today ? 'overdue' : day === today ? 'today' : day <= weekEnds ? 'week' : null)
  const dayOf = (instant: string | Date) => isoDate(localDay(yard.timeZone, new Date(instant).getTime()))

  const cards = await activeCards(db, yard, asOf)
  const who = new Map<string, Who>(
    cards.map((c) => [c.id, { vehicleId: c.id, stockNumber: c.stockNumber, vehicle: [c.year, c.make, c.model].filter(Boolean).join(' '), plate: c.plate }]),
  )
  const items: TodayItem[] = []
  const add = (kind: TodayKind, vehicleId: string, day: string | null, detail: string | null = null, when = whenOf(day), noticeKind: TodayItem['noticeKind'] = null, es?: string) => {
    const w = who.get(vehicleId)
    if (w && when && wanted.has(kind)) items.push({ kind, when, ...w, day, detail, noticeKind, ...(es ? { es: { detail: es } } : {}) })
  }

  const noticeWork = wanted.has('notice') || wanted.has('records-request') || wanted.has('deadline')
  const dueLetters = noticeWork ? await dueNotices(db, user.id, asOf) : []
  for (const n of dueLetters) add('notice', n.vehicleId, n.dueDate, n.kind, n.status === 'overdue' ? 'overdue' : n.dueDate === null ? 'now' : (whenOf(n.dueDate) ?? 'now'), n.kind)
  // A timeline step met by mailing a letter already listed above is that letter: it is not listed twice.
  const letterEvents = new Set(dueLetters.map((n) => `${n.vehicleId}:${NOTICE_EVENTS[n.kind]}`))

  const clockWork = noticeWork || wanted.has('police-notice') || wanted.has('lien-sale')
  const entries: DeadlineEntry[] = clockWork ? (await yardDeadlines(db, yard, DEADLINE_KINDS, asOf)).entries : []
  for (const e of entries) {
    const es = e.es?.label
    if (e.kind === 'police') add('police-notice', e.vehicleId, e.day, e.label, e.status === 'overdue' ? 'overdue' : whenOf(e.day), null, es)
    else if (e.kind === 'lien-sale') add('lien-sale', e.vehicleId, e.since ?? e.day, e.label, e.status === 'eligible' ? 'now' : whenOf(e.day), null, es)
    else if (e.doneBy === 'owner-records-requested') add('records-request', e.vehicleId, e.day, e.label, whenOf(e.day), null, es)
    else if (!letterEvents.has(`${e.vehicleId}:${e.doneBy}`)) add('deadline', e.vehicleId, e.day, e.label, whenOf(e.day), null, es)
  }

  for (const c of cards) {
    const arrived = dayOf(c.arrivedAt)
    if (c.state === 'teardown' && !c.inspectedAt) add('inspection', c.id, arrived, null, 'now')
    if (c.state === 'decision' && !c.ownerChoice) add('decision', c.id, arrived, null, 'now')
    if (c.state === 'release' || c.ownerChoice?.choice === 'collect') add('release', c.id, c.ownerChoice ? dayOf(c.ownerChoice.at) : null, c.ownerChoice?.choice ?? null, 'now')
    if (!c.space) add('no-space', c.id, arrived, null, 'now')
    if (c.photoCount === 0) add('no-photos', c.id, arrived, null, 'now')
    for (const h of c.holds) {
      // A hold that ends within the week, or has ended and is still set.
      if (h.until && Date.parse(h.until) < asOf.getTime() + WEEK_DAYS * DAY_MS) add('hold-ending', c.id, dayOf(h.until), h.kind)
    }
  }
  const rank = (w: When) => TODAY_WHEN.indexOf(w)
  items.sort((a, b) => rank(a.when) - rank(b.when) || (a.day ?? '').localeCompare(b.day ?? '') || a.stockNumber.localeCompare(b.stockNumber))
  return { role: user.role, today, weekEnds, timeZone: yard.timeZone, items }
}
