export { ruleSetsRouter } from './rule-sets.routes'
export { loadSampleRuleSets, sampleChoices, SAMPLE_RULE_SETS_DIR } from './sample-rule-sets'
export { addSampleWords } from './sample-words'
export { latestRuleSetBySlug, latestRuleSets, latestVersionOf, versionsById, type RuleSetVersion } from './rule-sets.queries'
