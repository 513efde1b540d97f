import { describe, expect, it } from 'vitest'
import { dayFromIsoDate, holidayCalendarFromList } from '@shared/domain/time'
import { usFederalCalendar } from '../../helpers/us-federal-holidays'

const day = (text: string) => dayFromIsoDate(text)

describe('holiday calendars', () => {
  it('holidayCalendarFromList_unsortedList_answersInDateOrder', () => {
    const calendar = holidayCalendarFromList([
      { date: '2026-03-31', name: 'César Chávez Day' },
      { date: '2026-01-01', name: "New Year's Day" },
    ])
    expect(calendar.between(day('2026-01-01'), day('2026-12-31')).map((h) => h.name)).toEqual(["New Year's Day", 'César Chávez Day'])
  })

  it('holidayCalendarFromList_rangeWithoutHolidays_isEmpty', () => {
    const calendar = holidayCalendarFromList([{ date: '2026-03-31', name: 'César Chávez Day' }])
    expect(calendar.between(day('2026-04-01'), day('2026-04-30'))).toEqual([])
  })

  it('holidayCalendarFromList_badDate_throwsInvalidDate', () => {
    expect(() => holidayCalendarFromList([{ date: '31/03/2026', name: 'x' }])).toThrow(expect.objectContaining({ code: 'invalid-date' }))
  })

  it('usFederalCalendar_rangeAcrossNewYear_includesBothYears', () => {
    const dates = usFederalCalendar().between(day('2027-12-20'), day('2028-01-20')).map((h) => h.date)
    expect(dates).toEqual(['2027-12-24', '2027-12-31', '2028-01-17'])
  })
})
