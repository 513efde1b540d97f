import { computed } from 'vue'
import { i18n } from '@/i18n'
import { pickerFormat } from '@/composables/yard-time'

// The pickers' plumbing. Showing a date or time is yard-time.ts's, on the yard's clock; a picker
// (Element Plus, dayjs) works on the browser's clock, so a day is typed through BaseYardDate and a
// date and time through BaseYardDateTime, which hands it the yard's wall clock. Both show the looks
// the screens show (pickerFormat), in the reader's language.

/** What a picker of this kind shows and reads (dayjs tokens), following the chosen language. */
export function usePickerFormat(look: 'date' | 'dateTime' | 'month') {
  return computed(() => pickerFormat(look, i18n.global.locale.value))
}

/**
 * Lets a picker's panel slide up over its own field to stay on screen: on a phone there is room for the
 * whole calendar, Now and OK included, but not always below or above the field.
 */
export const PICKER_POPPER_OPTIONS = { modifiers: [{ name: 'preventOverflow', options: { altAxis: true, tether: false, padding: 8 } }] }
