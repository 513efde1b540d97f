export { dueNoticesRouter, noticesRouter, type NoticesRouterDeps } from './notices.routes'
export { dueNotices } from './notices-due.service'
