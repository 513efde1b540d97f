export { outboxRouter, type OutboxDeps } from './outbox.routes'
export { queueMessage } from './outbox.queries'
export { OutboxWorker, type WorkerOptions } from './outbox-worker'
export { smtpTransport, type MailTransport, type OutgoingMail } from './mail-transport'
