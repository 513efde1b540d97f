export { policeNoticeRouter } from './police-notices.routes'
