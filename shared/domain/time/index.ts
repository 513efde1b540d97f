export * from './calendar-dates'
export * from './local-time'
export * from './business-days'
export * from './holidays'
