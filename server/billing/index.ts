export { cashDrawerRouter, vehicleBillingRouter } from './billing.routes'
export { moneyTotals, type MoneyTotals } from './billing.queries'
export { takePayment } from './payments.service'
export { invoiceOf } from './invoice.service'
