export { dueNoticesRouter, noticesRouter, type NoticesRouterDeps } from './notices.routes'
export { generateNotices } from './notices.service'
export { sendNotice } from './notice-sending.service'
export { dueNotices } from './notices-due.service'
