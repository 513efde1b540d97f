import { readdirSync, readFileSync } from 'node:fs'
import { join, relative } from 'node:path'
import dayjs from 'dayjs'
import customParseFormat from 'dayjs/plugin/customParseFormat.js'
import { describe, expect, it } from 'vitest'
import 'dayjs/locale/es.js'
import { pickerFormat, yardFormat, zoneAbbreviation } from '../../../src/composables/yard-time'

dayjs.extend(customParseFormat)

// Issue 16 item 8: four date looks across the screens (Element Plus's default "2026-12-01", the cash
// drawer's own, the browser's date input as its language has it, the date-time picker's). Every day is
// typed through BaseYardDate and every date and time through BaseYardDateTime, which take their look
// from the one formatter; this test fails on a field that brings its own.
const SRC = join(import.meta.dirname, '../../../src')
const THE_TWO = ['components/base/BaseYardDate.vue', 'components/base/BaseYardDateTime.vue']

function vueFiles(dir: string): string[] {
  return readdirSync(dir, { withFileTypes: true }).flatMap((e) => (e.isDirectory() ? vueFiles(join(dir, e.name)) : e.name.endsWith('.vue') ? [join(dir, e.name)] : []))
}
const sources = vueFiles(SRC)
  .map((file) => ({ file: relative(SRC, file), text: readFileSync(file, 'utf8') }))
  .filter((s) => !THE_TWO.includes(s.file))

/** What in a template makes a date or time field of its own look. */
const OWN_LOOKS: [string, RegExp][] = [
  ['an Element Plus date or time picker', /<el-(date|time)-picker\b|<ElDatePicker\b|<el-time-select\b/],
  ["the browser's own date or time input", /<(input|el-input)\b[^>]*\btype="(date|datetime-local|month|week|time)"/],
  ['a picker format of its own', /\s:?(value-)?format="/],
]

describe('one look for dates and one for dates with times', () => {
  it('the source check sees a field of its own look (planted)', () => {
    const planted = ['<el-date-picker v-model="d" />', '<el-input v-model="d" size="large" type="date" name="d" />', '<BaseYardDate v-model="d" format="YYYY/MM/DD" />']
    for (const [i, text] of planted.entries()) expect(OWN_LOOKS[i]![1].test(text)).toBe(true)
    expect(OWN_LOOKS.some(([, look]) => look.test('<BaseYardDate v-model="month" type="month" />'))).toBe(false)
  })

  it.each(OWN_LOOKS)('no screen has %s', (_, look) => {
    const offenders = sources.filter((s) => look.test(s.text)).map((s) => s.file)
    expect(offenders).toEqual([])
  })

  it('the two fields are used: every day or time typed goes through them', () => {
    const users = sources.filter((s) => /<BaseYardDate(Time)?\b/.test(s.text))
    expect(users.length).toBeGreaterThanOrEqual(15)
  })
})

// A Tuesday evening at a Los Angeles yard: 14:05 PST on 1 Dec 2026 (UTC−8, US daylight time having ended on
// 1 Nov 2026), and 15:05 PDT on 1 Jul 2026 (UTC−7). The shown looks are CLDR's (Node 20's ICU) for en-GB and es-US.
const WINTER = '2026-12-01T22:05:00Z'
const SUMMER = '2026-07-01T22:05:00Z'

describe('the pickers type the looks the screens show', () => {
  it.each([
    ['en', 'date', 'D[ ]MMM[ ]YYYY'],
    ['es', 'date', 'D[ ]MMM[ ]YYYY'],
    ['en', 'dateTime', 'D[ ]MMM[ ]YYYY[, ]HH[:]mm'],
    ['es', 'dateTime', 'D[ ]MMM[ ]YYYY[, ]HH[:]mm'],
    ['en', 'month', 'MMMM[ ]YYYY'],
    ['es', 'month', 'MMMM[ de ]YYYY'],
  ] as const)('pickerFormat_%s_%s_isIntlsOrderOfTheParts', (locale, look, tokens) => {
    expect(pickerFormat(look, locale)).toBe(tokens)
  })

  it.each(['en', 'es'] as const)('pickerFormat_%s_writesWhatTheScreensShowAndReadsItBack', (locale) => {
    // The picker is handed the yard's wall clock (14:05 on 1 Dec at the yard) as a browser-local reading.
    const wall = dayjs('2026-12-01T14:05:00').locale(locale)
    const shown = yardFormat('America/Los_Angeles', locale)
    expect(wall.format(pickerFormat('date', locale))).toBe(shown.date(WINTER))
    // The screens add the zone; the field names it beside itself.
    expect(`${wall.format(pickerFormat('dateTime', locale))} PST`).toBe(shown.dateTime(WINTER))
    for (const look of ['date', 'dateTime', 'month'] as const) {
      const typed = wall.format(pickerFormat(look, locale))
      const read = dayjs(typed, pickerFormat(look, locale), locale)
      expect(read.isValid()).toBe(true)
      expect(read.format(look === 'dateTime' ? 'YYYY-MM-DD HH:mm' : look === 'date' ? 'YYYY-MM-DD' : 'YYYY-MM')).toBe(
        look === 'dateTime' ? '2026-12-01 14:05' : look === 'date' ? '2026-12-01' : '2026-12',
      )
    }
  })
})

describe("times carry the yard's zone", () => {
  it.each(['en', 'es'] as const)('yardFormat_%s_labelsEachTimeWithTheZoneAsItStoodThen', (locale) => {
    const yard = yardFormat('America/Los_Angeles', locale)
    expect(yard.dateTime(WINTER)).toMatch(/14:05 PST$/)
    expect(yard.dateTime(SUMMER)).toMatch(/15:05 PDT$/)
    expect(yard.time(SUMMER)).toBe('15:05 PDT')
    // A day alone has no clock to label.
    expect(yard.date(WINTER)).not.toMatch(/P[SD]T/)
  })

  it('zoneAbbreviation_otherUsZones_areTheirUsNames', () => {
    // Eastern, Central, Mountain without daylight time (Arizona), Hawaii, Alaska: the US names in winter.
    expect(['America/New_York', 'America/Chicago', 'America/Phoenix', 'Pacific/Honolulu', 'America/Anchorage'].map((z) => zoneAbbreviation(z, WINTER, 'es'))).toEqual(['EST', 'CST', 'MST', 'HST', 'AKST'])
  })
})
