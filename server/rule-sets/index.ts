export { ruleSetsRouter } from './rule-sets.routes'
export { loadSampleRuleSets, sampleRuleSetsDir } from './sample-rule-sets'
export { latestRuleSetBySlug, latestVersionOf, versionsById } from './rule-sets.queries'
