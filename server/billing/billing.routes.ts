import { z } from 'zod'
import { Router } from 'express'
import type { Database } from '@db/client'
import {
  adjustmentInputSchema,
  businessDateSchema,
  closeoutInputSchema,
  declineInputSchema,
  invoiceQuerySchema,
  paymentInputSchema,
  refundInputSchema,
} from '@shared/schemas/billing'
import { vehicleParamsSchema } from '@shared/schemas/vehicles'
import { msg } from '@shared/schemas/field-messages'
import { receiptNumber, receiptPdf } from '../documents/index'
import { notFound } from '../errors'
import { vehicleForUser, type VehicleChanges } from '../vehicles/index'
import { adjustCharges, decideAdjustment } from './adjustments.service'
import { dueBeforeOf } from './billing.queries'
import { invoiceOf } from './invoice.service'
import { refund, takePayment } from './payments.service'
import { closeDrawer, drawerOf } from './closeout.service'
import { receiptInput, type ReceiptMail } from './receipt-mail'
import { documentLanguageQuerySchema } from '@shared/schemas/fields'

const paymentParams = vehicleParamsSchema.extend({ paymentId: z.uuid({ error: msg('common.thatNotPaymentId', 'That is not a payment id.') }) })
const adjustmentParams = vehicleParamsSchema.extend({ adjustmentId: z.uuid({ error: msg('common.thatNotAdjustmentId', 'That is not a waiver or discount id.') }) })

/** /api/vehicles/:vehicleId/…: the invoice, payments and refunds, waivers and discounts, receipts. */
export function vehicleBillingRouter(changes: VehicleChanges, mail: ReceiptMail): Router {
  const { db } = changes
  const router = Router({ mergeParams: true })
  router.get('/invoice', async (req, res) => {
    const { vehicleId } = vehicleParamsSchema.parse(req.params)
    const { asOf } = invoiceQuerySchema.parse(req.query)
    const { vehicle, yard } = await vehicleForUser(db, req.user!.id, vehicleId)
    res.json({ invoice: await invoiceOf(db, vehicle, yard, asOf ? new Date(asOf) : undefined) })
  })
  router.post('/payments', async (req, res) => {
    const { vehicleId } = vehicleParamsSchema.parse(req.params)
    const answer = await takePayment(changes, req.user!, vehicleId, paymentInputSchema.parse(req.body), mail)
    res.status(answer.replayed ? 200 : 201).json(answer)
  })
  router.post('/refunds', async (req, res) => {
    const { vehicleId } = vehicleParamsSchema.parse(req.params)
    const answer = await refund(changes, req.user!, vehicleId, refundInputSchema.parse(req.body))
    res.status(answer.replayed ? 200 : 201).json(answer)
  })
  router.get('/payments/:paymentId/receipt', async (req, res) => {
    const { vehicleId, paymentId } = paymentParams.parse(req.params)
    const { lang } = documentLanguageQuerySchema.parse(req.query)
    const { vehicle, yard } = await vehicleForUser(db, req.user!.id, vehicleId)
    const invoice = await invoiceOf(db, vehicle, yard)
    const payment = invoice.payments.find((p) => p.id === paymentId)
    if (!payment) throw notFound('That payment')
    const pdf = await receiptPdf(receiptInput(vehicle, yard, payment, await dueBeforeOf(db, paymentId)), lang)
    res.setHeader('Cache-Control', 'private, no-store')
    res.setHeader('Content-Disposition', `inline; filename="receipt-${receiptNumber(payment.id)}.pdf"`)
    res.type('application/pdf').send(Buffer.from(pdf))
  })
  router.post('/adjustments', async (req, res) => {
    const { vehicleId } = vehicleParamsSchema.parse(req.params)
    res.status(201).json(await adjustCharges(changes, req.user!, vehicleId, adjustmentInputSchema.parse(req.body)))
  })
  router.post('/adjustments/:adjustmentId/approve', async (req, res) => {
    const { vehicleId, adjustmentId } = adjustmentParams.parse(req.params)
    res.json(await decideAdjustment(changes, req.user!, vehicleId, adjustmentId, { approve: true }))
  })
  router.post('/adjustments/:adjustmentId/decline', async (req, res) => {
    const { vehicleId, adjustmentId } = adjustmentParams.parse(req.params)
    const { reason } = declineInputSchema.parse(req.body)
    res.json(await decideAdjustment(changes, req.user!, vehicleId, adjustmentId, { approve: false, reason }))
  })
  return router
}

/** /api/cash-drawer: the day's cash drawer and its close-out. */
export function cashDrawerRouter(db: Database): Router {
  const router = Router()
  router.get('/', async (req, res) => {
    const { date } = z.object({ date: businessDateSchema.optional() }).parse(req.query)
    res.json({ drawer: await drawerOf(db, req.user!, date) })
  })
  router.post('/closeout', async (req, res) => {
    res.status(201).json({ drawer: await closeDrawer(db, req.user!, closeoutInputSchema.parse(req.body)) })
  })
  return router
}
