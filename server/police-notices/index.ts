export { policeNoticeRouter } from './police-notices.routes'
export { recordPoliceNotice } from './police-notices.service'
