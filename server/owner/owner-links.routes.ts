import { Router } from 'express'
import { z } from 'zod'
import { vehicleParamsSchema } from '@shared/schemas/vehicles'
import { vehicleForUser, type VehicleChanges } from '../vehicles/index'
import { createOwnerLink, revokeOwnerLink } from './owner-links.service'
import { decisionsOf, linksOf } from './owner.queries'
import { msg } from '@shared/schemas/field-messages'

const linkParams = vehicleParamsSchema.extend({ linkId: z.uuid({ error: msg('common.thatNotOwnerLinkId', 'That is not an owner link id.') }) })

/** GET, POST /api/vehicles/:vehicleId/owner-links and POST …/:linkId/revoke — the office's side of the owner's page. */
export function ownerLinksRouter(changes: VehicleChanges, linkDays: number): Router {
  const { db } = changes
  const router = Router({ mergeParams: true })
  const answer = async (vehicleId: string) => ({ links: await linksOf(db, vehicleId), decisions: await decisionsOf(db, vehicleId) })

  router.get('/', async (req, res) => {
    const { vehicleId } = vehicleParamsSchema.parse(req.params)
    await vehicleForUser(db, req.user!.id, vehicleId)
    res.json(await answer(vehicleId))
  })
  router.post('/', async (req, res) => {
    const { vehicleId } = vehicleParamsSchema.parse(req.params)
    // The token and code are in this answer only; nothing else ever shows them again.
    res.setHeader('Cache-Control', 'no-store')
    res.status(201).json(await createOwnerLink(changes, req.user!, vehicleId, linkDays))
  })
  router.post('/:linkId/revoke', async (req, res) => {
    const { vehicleId, linkId } = linkParams.parse(req.params)
    await revokeOwnerLink(changes, req.user!, vehicleId, linkId)
    res.json(await answer(vehicleId))
  })
  return router
}
