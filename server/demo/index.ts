export { demoSignIns, loadDemoIfEmpty, type DemoLoaded } from './seed'
export { adoptDemoTemplate, buildDemoTemplate, resealHistory, usableDemoTemplate, type DemoTemplateMeta } from './template'
