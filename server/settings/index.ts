export { settingsRouter, vehicleRuleSetRouter } from './settings.routes'
