export { cashDrawerRouter, vehicleBillingRouter } from './billing.routes'
export { moneyTotals, type MoneyTotals } from './billing.queries'
export { drawerOf } from './closeout.service'
