import { Router, type Request } from 'express'
import { z } from 'zod'
import type { Database } from '@db/client'
import { vehicleParamsSchema } from '@shared/schemas/vehicles'
import { vehicleForUser } from '../vehicles/index'
import { keyTag } from './key-tag'

const languageQuery = z.object({ lang: z.enum(['en', 'es'], { error: 'Choose en or es.' }).default('en') })

export interface DocumentsDeps {
  db: Database
  /** Where people reach Holdfast (HOLDFAST_PUBLIC_URL); otherwise the address this request came to. */
  publicUrl?: string
}

export function publicBase(req: Request, publicUrl?: string) {
  return (publicUrl ?? `${req.protocol}://${req.host}`).replace(/\/+$/, '')
}

/** /api/vehicles/:vehicleId/documents: the vehicle's printed papers, made on request as PDF. */
export function documentsRouter({ db, publicUrl }: DocumentsDeps): Router {
  const router = Router({ mergeParams: true })
  router.get('/key-tag', async (req, res) => {
    const { vehicleId } = vehicleParamsSchema.parse(req.params)
    const { lang } = languageQuery.parse(req.query)
    const { vehicle, yard } = await vehicleForUser(db, req.user!.id, vehicleId)
    const pdf = await keyTag(vehicle, yard.name, `${publicBase(req, publicUrl)}/vehicles/${vehicle.id}`, lang)
    res.setHeader('Cache-Control', 'private, no-store')
    res.setHeader('Content-Disposition', `inline; filename="key-tag-${vehicle.stockNumber}.pdf"`)
    res.type('application/pdf').send(Buffer.from(pdf))
  })
  return router
}
