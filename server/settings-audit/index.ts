export { settingsAuditRouter } from './settings-audit.routes'
export { listSettingsChanges, recordSettingsChange, type SettingsChangeEntry } from './settings-audit.queries'
export { changedValues, itemNames } from './changed-values'
