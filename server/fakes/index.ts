export { fakesRouter, geocoderRouter } from './fakes.routes'
export { TOWN_CENTRE } from './orrin-flats'
export { startLocalSmtp, type LocalSmtp, type ReceivedMail } from './local-smtp'
export { signWebhook, startFakePaymentService, type FakePaymentService, type WebhookDelivery } from './payment-service'
