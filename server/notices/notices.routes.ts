import { Router } from 'express'
import { generateNoticesSchema, noticeParamsSchema, returnedSchema, sendingParamsSchema, sendNoticeSchema, type NoticesPage } from '@shared/schemas/notices'
import { vehicleParamsSchema } from '@shared/schemas/vehicles'
import type { Database } from '@db/client'
import { publicBase } from '../documents/index'
import { vehicleForUser } from '../vehicles/index'
import { noticeFacts } from './notice-inputs'
import { recordReturned, sendNotice } from './notice-sending.service'
import { dueNotices, sendDueNotices } from './notices-due.service'
import { noticesOf } from './notices.queries'
import { generateNotices, type NoticeDeps } from './notices.service'

export interface NoticesRouterDeps extends NoticeDeps {
  publicUrl?: string
}

/** The notices the rule set asks for and the letters made and sent, as every answer here gives them. */
async function noticesPage(db: Database, userId: string, vehicleId: string): Promise<NoticesPage> {
  const { vehicle, yard } = await vehicleForUser(db, userId, vehicleId)
  const facts = await noticeFacts(db, vehicle, yard, new Date())
  return { planned: facts?.plan ?? [], notices: await noticesOf(db, vehicleId) }
}

/** /api/vehicles/:vehicleId/notices: the letters to the owner and lienholders, and how they went out. */
export function noticesRouter(deps: NoticesRouterDeps): Router {
  const { db } = deps.changes
  const router = Router({ mergeParams: true })
  router.get('/', async (req, res) => {
    const { vehicleId } = vehicleParamsSchema.parse(req.params)
    res.json(await noticesPage(db, req.user!.id, vehicleId))
  })
  router.post('/', async (req, res) => {
    const { vehicleId } = vehicleParamsSchema.parse(req.params)
    await generateNotices(deps, req.user!, vehicleId, generateNoticesSchema.parse(req.body), publicBase(req, deps.publicUrl))
    res.status(201).json(await noticesPage(db, req.user!.id, vehicleId))
  })
  router.post('/due', async (req, res) => {
    const { vehicleId } = vehicleParamsSchema.parse(req.params)
    res.json({ results: await sendDueNotices(deps, req.user!, vehicleId, publicBase(req, deps.publicUrl)) })
  })
  router.post('/:noticeId/send', async (req, res) => {
    const { vehicleId, noticeId } = noticeParamsSchema.parse(req.params)
    await sendNotice(deps, req.user!, vehicleId, noticeId, sendNoticeSchema.parse(req.body))
    res.json(await noticesPage(db, req.user!.id, vehicleId))
  })
  router.post('/:noticeId/sendings/:sendingId/returned', async (req, res) => {
    const { vehicleId, noticeId, sendingId } = sendingParamsSchema.parse(req.params)
    await recordReturned(deps, req.user!, vehicleId, noticeId, sendingId, returnedSchema.parse(req.body))
    res.json(await noticesPage(db, req.user!.id, vehicleId))
  })
  return router
}

/** GET /api/notices/due: every notice due now across the yard, for the office's "send all due" button. */
export function dueNoticesRouter(db: Database): Router {
  const router = Router()
  router.get('/due', async (req, res) => {
    res.json({ due: await dueNotices(db, req.user!.id) })
  })
  return router
}
