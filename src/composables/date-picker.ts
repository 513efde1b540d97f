// The date-and-time pickers' plumbing. Showing a date or time is yard-time.ts's, on the yard's clock;
// a picker (Element Plus, dayjs) works on the browser's clock.
const pad = (n: number) => String(Math.abs(n)).padStart(2, '0')

/** The browser's wall-clock time with its offset, the shape the date pickers read and write. */
export function localIso(d = new Date()): string {
  const off = -d.getTimezoneOffset()
  const zone = `${off >= 0 ? '+' : '-'}${pad(Math.floor(Math.abs(off) / 60))}:${pad(off % 60)}`
  return `${d.getFullYear()}-${pad(d.getMonth() + 1)}-${pad(d.getDate())}T${pad(d.getHours())}:${pad(d.getMinutes())}:${pad(d.getSeconds())}${zone}`
}

/** The value format of every date-and-time picker: ISO 8601 with the offset, as the schemas require. */
export const PICKER_FORMAT = 'YYYY-MM-DDTHH:mm:ssZ'

/** What a picker shows (dayjs tokens): the date-time look of the rest of the app (yard-time.ts). */
export const PICKER_DISPLAY_FORMAT = 'ddd, D MMM YYYY, HH:mm'

/**
 * Lets a picker's panel slide up over its own field to stay on screen: on a phone there is room for the
 * whole calendar, Now and OK included, but not always below or above the field.
 */
export const PICKER_POPPER_OPTIONS = { modifiers: [{ name: 'preventOverflow', options: { altAxis: true, tether: false, padding: 8 } }] }
