import { Router } from 'express'
import type { Database } from '@db/client'
import { type ContactsPage, contactInputSchema, contactParamsSchema, recordsAnswerSchema, recordsParamsSchema, recordsRequestInputSchema } from '@shared/schemas/contacts'
import { vehicleParamsSchema } from '@shared/schemas/vehicles'
import { stepWords } from '@shared/messages/rule-words'
import { vehicleClocks } from '../clock-events/index'
import { vehicleForUser, type VehicleChanges } from '../vehicles/index'
import { contactsOf, recordsRequestsOf } from './contacts.queries'
import { addContact, answerRecordsRequest, changeContact, recordRecordsRequest, removeContact } from './contacts.service'

/** The vehicle's contacts and records requests, and where the deadline to request the records stands: every answer here. */
export async function contactsPage(db: Database, userId: string, vehicleId: string): Promise<ContactsPage> {
  const { vehicle, yard } = await vehicleForUser(db, userId, vehicleId)
  const worked = await vehicleClocks(db, vehicle, yard)
  const step = worked?.clocks.deadlines.find((d) => d.kind === 'deadline' && d.doneBy.event === 'owner-records-requested')
  return {
    contacts: await contactsOf(db, vehicleId),
    recordsRequests: await recordsRequestsOf(db, vehicleId),
    recordsDeadline: step
      ? { label: step.label, status: step.status, dueDate: step.dueDate ?? null, doneAt: step.doneBy.at ?? null, citation: step.source.citation, ...(stepWords(step) ? { es: stepWords(step) } : {}) }
      : null,
  }
}

/** /api/vehicles/:vehicleId/contacts: who to tell about the vehicle. */
export function contactsRouter(changes: VehicleChanges): Router {
  const { db } = changes
  const router = Router({ mergeParams: true })
  router.get('/', async (req, res) => {
    const { vehicleId } = vehicleParamsSchema.parse(req.params)
    res.json(await contactsPage(db, req.user!.id, vehicleId))
  })
  router.post('/', async (req, res) => {
    const { vehicleId } = vehicleParamsSchema.parse(req.params)
    await addContact(changes, req.user!, vehicleId, contactInputSchema.parse(req.body))
    res.status(201).json(await contactsPage(db, req.user!.id, vehicleId))
  })
  router.put('/:contactId', async (req, res) => {
    const { vehicleId, contactId } = contactParamsSchema.parse(req.params)
    await changeContact(changes, req.user!, vehicleId, contactId, contactInputSchema.parse(req.body))
    res.json(await contactsPage(db, req.user!.id, vehicleId))
  })
  router.delete('/:contactId', async (req, res) => {
    const { vehicleId, contactId } = contactParamsSchema.parse(req.params)
    await removeContact(changes, req.user!, vehicleId, contactId)
    res.json(await contactsPage(db, req.user!.id, vehicleId))
  })
  return router
}

/** /api/vehicles/:vehicleId/records-requests: the state records request and its answer. */
export function recordsRequestsRouter(changes: VehicleChanges): Router {
  const { db } = changes
  const router = Router({ mergeParams: true })
  router.post('/', async (req, res) => {
    const { vehicleId } = vehicleParamsSchema.parse(req.params)
    await recordRecordsRequest(changes, req.user!, vehicleId, recordsRequestInputSchema.parse(req.body))
    res.status(201).json(await contactsPage(db, req.user!.id, vehicleId))
  })
  router.put('/:requestId/answer', async (req, res) => {
    const { vehicleId, requestId } = recordsParamsSchema.parse(req.params)
    await answerRecordsRequest(changes, req.user!, vehicleId, requestId, recordsAnswerSchema.parse(req.body))
    res.json(await contactsPage(db, req.user!.id, vehicleId))
  })
  return router
}
