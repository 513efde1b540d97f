export { fakesRouter } from './fakes.routes'
export { startLocalSmtp, type LocalSmtp, type ReceivedMail } from './local-smtp'
