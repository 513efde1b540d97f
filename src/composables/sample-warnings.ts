import { useI18n } from 'vue-i18n'
import type { SampleWarningView } from '@shared/schemas/charges'
import { useRuleWords } from './rule-words'

/**
 * The bill's "sample — set your rate" warnings in the reader's language, a class or fee named in the
 * rule set's own Spanish where it has it; an answer without them (an older server) shows its English.
 */
export function useSampleWarnings() {
  const { t } = useI18n()
  const words = useRuleWords()
  return (samples: readonly SampleWarningView[] | undefined, english: readonly string[]): string[] =>
    samples ? samples.map((w) => (w.code === 'sample-tax' ? t('billing.samples.sample-tax') : t(`billing.samples.${w.code}`, { label: words(w).label }))) : [...english]
}
