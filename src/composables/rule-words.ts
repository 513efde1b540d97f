import { useI18n } from 'vue-i18n'
import { ruleWords, type Worded } from '@shared/messages/rule-words'
import { isLocale } from '@/i18n/locales'

/**
 * A rule set's own words (a step's label, a fee's name, a citation) in the reader's language, where the
 * rule set has them, else its English: `const words = useRuleWords()` then `words(deadline).label`.
 * Reads the locale at call time, so a language switch re-renders.
 */
export function useRuleWords() {
  const { locale } = useI18n()
  return <T extends Worded>(item: T): T => ruleWords(item, isLocale(locale.value) ? locale.value : 'en')
}
