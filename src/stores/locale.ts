import { defineStore } from 'pinia'
import { computed, ref, watch } from 'vue'
import { i18n } from '@/i18n'
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

  function choose(next: Locale) {
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

  return { locale: computed(() => locale.value), choose }
})
