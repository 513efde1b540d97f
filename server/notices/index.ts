export { dueNoticesRouter, noticesRouter, type NoticesRouterDeps } from './notices.routes'
