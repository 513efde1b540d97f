// @vitest-environment happy-dom
import { createPinia, setActivePinia } from 'pinia'
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest'
import { nextTick } from 'vue'
import { i18n } from '../../../src/i18n'
import { browserLocale } from '../../../src/i18n/locales'
import { useLocaleStore } from '../../../src/stores/locale'

beforeEach(() => {
  localStorage.clear()
  setActivePinia(createPinia())
})
afterEach(() => {
  vi.unstubAllGlobals()
  i18n.global.locale.value = 'en'
})

describe('browserLocale', () => {
  it.each([
    [['es-MX', 'en-US'], 'es'],
    [['fr-FR', 'es-ES'], 'es'],
    [['en-GB'], 'en'],
    [['de-DE', 'fr-FR'], 'en'],
    [[], 'en'],
  ])('browserLocale_%j_is_%s (the first language Holdfast speaks, else English)', (languages, expected) => {
    expect(browserLocale(languages)).toBe(expected)
  })
})

describe('the locale store', () => {
  it('localeStore_nothingChosen_takesTheBrowsersLanguageAndSetsThePage', async () => {
    vi.stubGlobal('navigator', { languages: ['es-US', 'en'], language: 'es-US' })
    const store = useLocaleStore()
    await nextTick()
    expect(store.locale).toBe('es')
    expect(i18n.global.locale.value).toBe('es')
    expect(document.documentElement.lang).toBe('es')
    expect(i18n.global.t('signIn.submit')).toBe('Entrar')
  })

  it('localeStore_chosenBefore_winsOverTheBrowser', () => {
    localStorage.setItem('holdfast.locale', 'en')
    vi.stubGlobal('navigator', { languages: ['es-ES'], language: 'es-ES' })
    expect(useLocaleStore().locale).toBe('en')
  })

  it('localeStore_choose_switchesEveryTextAndIsRememberedOnThisDevice', async () => {
    const store = useLocaleStore()
    store.choose('es')
    await nextTick()
    expect(i18n.global.t('board.card.move')).toBe('Mover a…')
    expect(localStorage.getItem('holdfast.locale')).toBe('es')
    store.choose('en')
    await nextTick()
    expect(i18n.global.t('board.card.move')).toBe('Move to…')
  })

  it('localeStore_rememberedValueNotALanguage_isIgnored', () => {
    localStorage.setItem('holdfast.locale', 'klingon')
    vi.stubGlobal('navigator', { languages: ['en-US'], language: 'en-US' })
    expect(useLocaleStore().locale).toBe('en')
  })
})

describe('plurals in both languages', () => {
  it.each([
    ['en', 1, '1 photo'],
    ['en', 3, '3 photos'],
    ['es', 1, '1 foto'],
    ['es', 3, '3 fotos'],
  ] as const)('board.card.photos in %s for %i is "%s"', (locale, n, expected) => {
    i18n.global.locale.value = locale
    expect(i18n.global.t('board.card.photos', { n }, n)).toBe(expected)
  })
})
