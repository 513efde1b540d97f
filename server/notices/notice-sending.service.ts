import { and, eq } from 'drizzle-orm'
import { noticeSendings, vehicleContacts } from '@db/schema'
import { NOTICE_EVENTS } from '@shared/domain/notices'
import { postalAddress } from '@shared/schemas/contacts'
import type { ReturnedInput, SendNotice } from '@shared/schemas/notices'
import type { User } from '@shared/schemas/users'
import { addClockEvent } from '../clock-events/index'
import { pastDay } from '../contacts/index'
import { badRequest, conflict, fieldIssue, notFound, summaryOf, type Issue, said } from '../errors'
import { queueMessage } from '../outbox/index'
import { changeVehicle } from '../vehicles/index'
import { LETTER_WORDS } from './letter-words'
import type { NoticeDeps } from './notices.service'
import { noticeOf } from './notices.queries'

/**
 * Sends a notice by certified mail (its tracking number and mailing day: the clock event that starts or
 * meets the clocks) and/or by e-mail (queued in the outbox with the PDF attached, in the same
 * transaction). Each sending is a history event. A recipient without the address a method needs is
 * refused, naming the field, and nothing is written.
 */
export async function sendNotice(deps: NoticeDeps, actor: User, vehicleId: string, noticeId: string, input: SendNotice): Promise<void> {
  await changeVehicle(deps.changes, actor, vehicleId, async ({ tx, vehicle, yard, record }) => {
    if (vehicle.state === 'closed') throw conflict('This vehicle has left the yard: its notices can no longer be sent.', said('closedNoticeSend'))
    const notice = await noticeOf(tx, vehicleId, noticeId)
    if (!notice) throw notFound('That notice')
    const [contact] = await tx.select().from(vehicleContacts).where(eq(vehicleContacts.id, notice.contactId))
    if (!contact || contact.removedAt) throw conflict('This recipient was removed from the contacts; make the notice again for whoever replaces them.', said('recipientRemoved'))
    const issues: Issue[] = []
    if (input.certifiedMail && !postalAddress(contact)) {
      issues.push(fieldIssue('certifiedMail', 'notices.noPostalAddress', `${contact.name} has no postal address on record: add it before sending by certified mail.`, { name: contact.name }))
    }
    if (input.email && !contact.email) issues.push(fieldIssue('email', 'notices.noEmailAddress', `${contact.name} has no e-mail address on record: add it before sending by e-mail.`, { name: contact.name }))
    if (issues.length > 0) throw badRequest(summaryOf(issues), issues)
    if (input.certifiedMail) {
      const mailedAt = pastDay(input.mailedOn!, yard.timeZone, 'mailedOn', 'mailedOn')
      const [row] = await tx
        .insert(noticeSendings)
        .values({ noticeId, method: 'certified_mail', trackingNumber: input.trackingNumber, mailedOn: input.mailedOn, createdById: actor.id })
        .returning({ id: noticeSendings.id })
      await addClockEvent(tx, { vehicleId, kind: NOTICE_EVENTS[notice.kind], at: mailedAt, source: 'notice-sending', sourceId: row!.id, recordedById: actor.id })
      record({ kind: 'notice_sent', after: { noticeId, sendingId: row!.id, method: 'certified_mail', to: contact.name, trackingNumber: input.trackingNumber, mailedOn: input.mailedOn } })
    }
    if (input.email) {
      const w = LETTER_WORDS[notice.language]
      const message = await queueMessage(tx, yard.companyId, actor.id, {
        to: contact.email!,
        toName: contact.name,
        subject: w.emailSubject(notice.kind, vehicle.stockNumber, yard.name),
        text: w.emailText(contact.name, yard.name, yard.phone),
        language: notice.language,
        purpose: `notice.${notice.kind}`,
        vehicleId,
        attachments: [{ filename: `notice-${vehicle.stockNumber}-${notice.kind.replace('_', '-')}.pdf`, contentType: 'application/pdf', fileId: notice.fileId }],
      })
      const [row] = await tx
        .insert(noticeSendings)
        .values({ noticeId, method: 'email', emailTo: contact.email, outboxMessageId: message.id, createdById: actor.id })
        .returning({ id: noticeSendings.id })
      record({ kind: 'notice_sent', after: { noticeId, sendingId: row!.id, method: 'email', to: contact.email, outboxMessageId: message.id } })
    }
  })
  if (input.email) deps.kick?.()
}

/** A letter came back (refused, unclaimed, no such address): recorded on its sending, a history event. */
export async function recordReturned(deps: NoticeDeps, actor: User, vehicleId: string, noticeId: string, sendingId: string, input: ReturnedInput): Promise<void> {
  await changeVehicle(deps.changes, actor, vehicleId, async ({ tx, yard, record }) => {
    const notice = await noticeOf(tx, vehicleId, noticeId)
    if (!notice) throw notFound('That notice')
    const [sending] = await tx.select().from(noticeSendings).where(and(eq(noticeSendings.id, sendingId), eq(noticeSendings.noticeId, noticeId)))
    if (!sending) throw notFound('That sending')
    if (sending.returnedOn) throw conflict(`This letter was already recorded as returned on ${sending.returnedOn}.`, said('letterReturned', { date: sending.returnedOn }))
    pastDay(input.returnedOn, yard.timeZone, 'returnedOn', 'cameBackOn')
    if (sending.mailedOn && input.returnedOn < sending.mailedOn) {
      const message = 'A letter cannot come back before it was mailed.'
      throw badRequest(message, [fieldIssue('returnedOn', 'notices.backBeforeMailed', message)])
    }
    const note = input.note ?? null
    await tx.update(noticeSendings).set({ returnedOn: input.returnedOn, returnNote: note }).where(eq(noticeSendings.id, sendingId))
    record({ kind: 'notice_returned', after: { noticeId, sendingId, returnedOn: input.returnedOn, note } })
  })
}
