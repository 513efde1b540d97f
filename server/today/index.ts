export { todayRouter } from './today.routes'
export { todayOf } from './today.service'
