export { contactsRouter, recordsRequestsRouter } from './contacts.routes'
export { contactOf, contactsOf, type ContactRow } from './contacts.queries'
export { pastDay } from './yard-days'
export { addContact, answerRecordsRequest, recordRecordsRequest } from './contacts.service'
