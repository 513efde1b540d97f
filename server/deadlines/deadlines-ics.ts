import { createEvents, type DateArray, type EventAttributes } from 'ics'
import type { DeadlineEntry, DeadlineList } from '@shared/schemas/deadlines'

const dayArray = (iso: string): DateArray => iso.split('-').map(Number) as DateArray

/**
 * The Deadlines page as an RFC 5545 calendar, made by the `ics` package. A police clock is an event at
 * its minute (epoch ms, in and out as UTC: the package writes no TZID); every other deadline is an
 * all-day event on the yard's calendar day, which needs no zone at all. A deadline keeps its UID across
 * refreshes, so a calendar app moves it rather than adding another.
 */
export function deadlinesCalendar(list: DeadlineList, yardName: string, vehicleUrl: (vehicleId: string) => string): string {
  const events = list.entries.map((e) => event(e, vehicleUrl(e.vehicleId)))
  const { error, value } = createEvents(events, { productId: 'holdfast/deadlines', calName: `Holdfast deadlines — ${yardName}` })
  if (error || value === null) throw error ?? new Error('The calendar could not be written.')
  return value
}

function event(e: DeadlineEntry, url: string): EventAttributes {
  const when: Pick<EventAttributes, 'start' | 'startInputType' | 'startOutputType'> & ({ duration: { minutes: number } } | { duration: { days: number } }) =
    e.kind === 'police' && e.dueAt
      ? { start: Date.parse(e.dueAt), startInputType: 'utc', startOutputType: 'utc', duration: { minutes: 15 } }
      : { start: dayArray(e.since ?? e.day), duration: { days: 1 } }
  const title = `${e.stockNumber} · ${e.label}${e.status === 'overdue' ? ' (overdue)' : e.status === 'eligible' ? ' (eligible now)' : ''}`
  const vehicle = [e.vehicle, e.plate].filter(Boolean).join(', ')
  return {
    ...when,
    uid: `${e.vehicleId}.${e.code}@holdfast`,
    title,
    description: [vehicle, e.explanation, e.citation].filter(Boolean).join('\n'),
    url,
    categories: [e.kind],
    transp: 'TRANSPARENT',
  }
}
