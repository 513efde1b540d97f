export { cardCheckoutsRouter, cardRefundsRouter, cardWebhookRouter, startOwnerCheckout, type CardPaymentDeps } from './card-payments.routes'
export { cardPaymentsClient, type CardPayments } from './card-payments.service'
