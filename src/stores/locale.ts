import { defineStore } from 'pinia'
import { computed, ref, watch } from 'vue'
import { i18n, loadMessages } from '@/i18n'
import { browserLocale, isLocale, type Locale } from '@/i18n/locales'

const STORAGE_KEY = 'holdfast.locale'

function remembered(): Locale | null {
  try {
    const saved = localStorage.getItem(STORAGE_KEY)
    return isLocale(saved) ? saved : null
  } catch {
    return null
  }
}

/**
 * The language this browser shows: the one chosen here last, else the browser's own. Choosing one
 * switches every screen at once, Element Plus's texts included, and is remembered on this device.
 */
export const useLocaleStore = defineStore('locale', () => {
  const locale = ref<Locale>(remembered() ?? browserLocale())
  /** Whether every screen's messages (not only the sign-in page's) are wanted in this language yet. */
  let everything = false

  /** Fetches every screen's messages in the chosen language; the router awaits it before a page. */
  function ready(): Promise<void> {
    everything = true
    return loadMessages(locale.value)
  }

  async function choose(next: Locale) {
    // The new language's messages arrive before the screen switches, so nothing shows as a key.
    if (everything) await loadMessages(next)
    locale.value = next
    try {
      localStorage.setItem(STORAGE_KEY, next)
    } catch {
      // Private browsing may refuse storage; the choice still holds for this visit.
    }
  }

  watch(
    locale,
    (now) => {
      i18n.global.locale.value = now
      document.documentElement.lang = now
    },
    { immediate: true },
  )

  return { locale: computed(() => locale.value), choose, ready }
})
