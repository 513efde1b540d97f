import { Router } from 'express'
import { signatureInputSchema } from '@shared/schemas/releases'
import { transferInputSchema } from '@shared/schemas/transfers'
import { vehicleParamsSchema } from '@shared/schemas/vehicles'
import { sendPdf } from '../documents/index'
import type { FileStore } from '../files/index'
import type { VehicleChanges } from '../vehicles/index'
import { recordTransfer, signTransfer, transferPacketPdf, transferPage } from './transfers.service'
import { documentLanguageQuerySchema } from '@shared/schemas/fields'


/** Mounted at /api/vehicles/:vehicleId/transfer: a sign-over or lien sale, its bill of sale and packet. */
export function transfersRouter({ changes, files }: { changes: VehicleChanges; files: FileStore }): Router {
  const { db } = changes
  const router = Router({ mergeParams: true })
  router.get('/', async (req, res) => {
    const { vehicleId } = vehicleParamsSchema.parse(req.params)
    res.json(await transferPage(db, req.user!, vehicleId))
  })
  router.put('/', async (req, res) => {
    const { vehicleId } = vehicleParamsSchema.parse(req.params)
    await recordTransfer(changes, req.user!, vehicleId, transferInputSchema.parse(req.body))
    res.json(await transferPage(db, req.user!, vehicleId))
  })
  router.post('/signature', async (req, res) => {
    const { vehicleId } = vehicleParamsSchema.parse(req.params)
    await signTransfer(changes, files, req.user!, vehicleId, signatureInputSchema.parse(req.body))
    res.status(201).json(await transferPage(db, req.user!, vehicleId))
  })
  router.get('/packet', async (req, res) => {
    const { vehicleId } = vehicleParamsSchema.parse(req.params)
    const { lang } = documentLanguageQuerySchema.parse(req.query)
    const { pdf, stockNumber } = await transferPacketPdf(db, files, req.user!, vehicleId, lang)
    sendPdf(res, pdf, `transfer-${stockNumber}.pdf`)
  })
  return router
}
