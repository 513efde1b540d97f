export { yardSettingsRouter } from './yard-settings.routes'
