import { and, eq } from 'drizzle-orm'
import { recordsRequests, vehicleContacts } from '@db/schema'
import type { Contact, RecordsAnswer, RecordsRequest } from '@shared/schemas/contacts'
import type { User } from '@shared/schemas/users'
import { addClockEvent } from '../clock-events/index'
import { badRequest, conflict, fieldIssue, notFound, unprocessable, said } from '../errors'
import { changeVehicle, type VehicleChanges } from '../vehicles/index'
import { contactOf, contactRecord } from './contacts.queries'
import { pastDay } from './yard-days'

const closed = () => conflict('This vehicle has left the yard; its contacts can no longer be changed.', said('closedContacts'))

// What the history keeps of a contact: who they are and how to reach them (the office's own record).
const described = (c: Contact | ReturnType<typeof contactRecord>) => ({
  role: c.role,
  name: c.name,
  street: c.street,
  city: c.city,
  state: c.state,
  zip: c.zip,
  phone: c.phone,
  email: c.email,
  language: c.language,
  source: c.source,
  sourceDate: c.sourceDate,
  sourceNote: c.sourceNote,
})

export async function addContact(changes: VehicleChanges, actor: User, vehicleId: string, input: Contact): Promise<string> {
  const { result } = await changeVehicle(changes, actor, vehicleId, async ({ tx, vehicle, yard, record }) => {
    if (vehicle.state === 'closed') throw closed()
    if (input.sourceDate) pastDay(input.sourceDate, yard.timeZone, 'sourceDate', 'recordsRequestDate')
    const [row] = await tx.insert(vehicleContacts).values({ vehicleId, ...input, createdById: actor.id }).returning({ id: vehicleContacts.id })
    record({ kind: 'contact_added', after: { contactId: row!.id, ...described(input) } })
    return row!.id
  })
  return result
}

export async function changeContact(changes: VehicleChanges, actor: User, vehicleId: string, contactId: string, input: Contact): Promise<void> {
  await changeVehicle(changes, actor, vehicleId, async ({ tx, vehicle, yard, record }) => {
    if (vehicle.state === 'closed') throw closed()
    const current = await contactOf(tx, vehicleId, contactId)
    if (!current) throw notFound('That contact')
    if (input.sourceDate) pastDay(input.sourceDate, yard.timeZone, 'sourceDate', 'recordsRequestDate')
    const before = described(contactRecord(current))
    const after = described(input)
    if (JSON.stringify(before) === JSON.stringify(after)) throw unprocessable('Nothing was changed: the record already says that.', said('nothingChanged'))
    await tx.update(vehicleContacts).set({ ...input, updatedAt: new Date() }).where(eq(vehicleContacts.id, contactId))
    record({ kind: 'contact_changed', before: { contactId, ...before }, after: { contactId, ...after } })
  })
}

export async function removeContact(changes: VehicleChanges, actor: User, vehicleId: string, contactId: string): Promise<void> {
  await changeVehicle(changes, actor, vehicleId, async ({ tx, vehicle, record }) => {
    if (vehicle.state === 'closed') throw closed()
    const current = await contactOf(tx, vehicleId, contactId)
    if (!current) throw notFound('That contact')
    await tx.update(vehicleContacts).set({ removedAt: new Date(), removedById: actor.id }).where(eq(vehicleContacts.id, contactId))
    record({ kind: 'contact_removed', before: { contactId, ...described(contactRecord(current)) } })
  })
}

/**
 * A state records request sent (and perhaps already answered): its sending day is the clock event
 * "owner-records-requested", which meets the rule set's deadline to request the records.
 */
export async function recordRecordsRequest(changes: VehicleChanges, actor: User, vehicleId: string, input: RecordsRequest): Promise<string> {
  const { result } = await changeVehicle(changes, actor, vehicleId, async ({ tx, vehicle, yard, now, record }) => {
    if (vehicle.state === 'closed') throw closed()
    const sentAt = pastDay(input.sentOn, yard.timeZone, 'sentOn', 'requestSentOn', now)
    if (input.answeredOn) pastDay(input.answeredOn, yard.timeZone, 'answeredOn', 'answerCameOn', now)
    const [row] = await tx
      .insert(recordsRequests)
      .values({ vehicleId, agency: input.agency, sentOn: input.sentOn, answeredOn: input.answeredOn, outcome: input.outcome, createdById: actor.id, createdAt: now })
      .returning({ id: recordsRequests.id })
    await addClockEvent(tx, { vehicleId, kind: 'owner-records-requested', at: sentAt, source: 'records-request', sourceId: row!.id, recordedById: actor.id })
    record({ kind: 'records_requested', after: { requestId: row!.id, agency: input.agency, sentOn: input.sentOn } })
    if (input.answeredOn) record({ kind: 'records_answered', after: { requestId: row!.id, answeredOn: input.answeredOn, outcome: input.outcome } })
    return row!.id
  })
  return result
}

export async function answerRecordsRequest(changes: VehicleChanges, actor: User, vehicleId: string, requestId: string, input: RecordsAnswer): Promise<void> {
  await changeVehicle(changes, actor, vehicleId, async ({ tx, vehicle, yard, now, record }) => {
    if (vehicle.state === 'closed') throw closed()
    const [request] = await tx.select().from(recordsRequests).where(and(eq(recordsRequests.id, requestId), eq(recordsRequests.vehicleId, vehicleId)))
    if (!request) throw notFound('That records request')
    if (request.answeredOn) throw conflict(`This request was already answered on ${request.answeredOn}.`, said('requestAnswered', { date: request.answeredOn }))
    pastDay(input.answeredOn, yard.timeZone, 'answeredOn', 'answerCameOn', now)
    if (input.answeredOn < request.sentOn) {
      const message = 'The answer cannot come before the request was sent.'
      throw badRequest(message, [fieldIssue('answeredOn', 'contacts.answerBeforeSent', message)])
    }
    await tx.update(recordsRequests).set({ answeredOn: input.answeredOn, outcome: input.outcome }).where(eq(recordsRequests.id, requestId))
    record({ kind: 'records_answered', after: { requestId, answeredOn: input.answeredOn, outcome: input.outcome } })
  })
}
