import { Router, type Request, type Response } from 'express'
import type { Database } from '@db/client'
import { vehicleParamsSchema } from '@shared/schemas/vehicles'
import { spaceOf, vehicleForUser } from '../vehicles/index'
import { keyTag } from './key-tag'
import { pickupTicket } from './pickup-ticket'
import { documentLanguageQuerySchema } from '@shared/schemas/fields'


export interface DocumentsDeps {
  db: Database
  /** Where people reach Holdfast (HOLDFAST_PUBLIC_URL); otherwise the address this request came to. */
  publicUrl?: string
}

export function publicBase(req: Request, publicUrl?: string) {
  return (publicUrl ?? `${req.protocol}://${req.host}`).replace(/\/+$/, '')
}

/** A printed paper: never cached, shown in the browser's own viewer. */
export function sendPdf(res: Response, pdf: Uint8Array, filename: string) {
  res.setHeader('Cache-Control', 'private, no-store')
  res.setHeader('Content-Disposition', `inline; filename="${filename}"`)
  res.type('application/pdf').send(Buffer.from(pdf))
}

/** /api/vehicles/:vehicleId/documents: the vehicle's printed papers, made on request as PDF. */
export function documentsRouter({ db, publicUrl }: DocumentsDeps): Router {
  const router = Router({ mergeParams: true })
  router.get('/key-tag', async (req, res) => {
    const { vehicleId } = vehicleParamsSchema.parse(req.params)
    const { lang } = documentLanguageQuerySchema.parse(req.query)
    const { vehicle, yard } = await vehicleForUser(db, req.user!.id, vehicleId)
    const pdf = await keyTag(vehicle, yard.name, `${publicBase(req, publicUrl)}/vehicles/${vehicle.id}`, lang)
    res.setHeader('Cache-Control', 'private, no-store')
    res.setHeader('Content-Disposition', `inline; filename="key-tag-${vehicle.stockNumber}.pdf"`)
    res.type('application/pdf').send(Buffer.from(pdf))
  })
  router.get('/pickup-ticket', async (req, res) => {
    const { vehicleId } = vehicleParamsSchema.parse(req.params)
    const { lang } = documentLanguageQuerySchema.parse(req.query)
    const { vehicle, yard } = await vehicleForUser(db, req.user!.id, vehicleId)
    const space = (await spaceOf(db, vehicle.spaceId))?.label ?? null
    const pdf = await pickupTicket({ yard, vehicle, space, printedAt: new Date() }, lang)
    sendPdf(res, pdf, `pickup-ticket-${vehicle.stockNumber}.pdf`)
  })
  return router
}
