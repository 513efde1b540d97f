export { fakesRouter } from './fakes.routes'
export { startLocalSmtp, type LocalSmtp, type ReceivedMail } from './local-smtp'
export { signWebhook, startFakePaymentService, type FakePaymentService, type WebhookDelivery } from './payment-service'
