// The date-and-time pickers' plumbing. Showing a date or time is yard-time.ts's, on the yard's clock;
// a picker (Element Plus, dayjs) works on the browser's clock, so times are typed through
// BaseYardDateTime, which hands it the yard's wall clock.

/** What a picker shows (dayjs tokens): the date-time look of the rest of the app (yard-time.ts). */
export const PICKER_DISPLAY_FORMAT = 'ddd, D MMM YYYY, HH:mm'

/**
 * Lets a picker's panel slide up over its own field to stay on screen: on a phone there is room for the
 * whole calendar, Now and OK included, but not always below or above the field.
 */
export const PICKER_POPPER_OPTIONS = { modifiers: [{ name: 'preventOverflow', options: { altAxis: true, tether: false, padding: 8 } }] }
