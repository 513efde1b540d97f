export { yardSettingsRouter } from './yard-settings.routes'
export { insertSpaces } from './yard-settings.service'
