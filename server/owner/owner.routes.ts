import { Router, type Request, type Response } from 'express'
import { ownerDecisionInputSchema, ownerFileParamsSchema, ownerKeyParamsSchema, ownerQuoteQuerySchema } from '@shared/schemas/owner'
import { AppError, notFound, said } from '../errors'
import { sendVehicleFile, type FileStore } from '../files/index'
import type { MapConfig } from '../map/index'
import { startOwnerCheckout, type CardPaymentDeps } from '../card-payments/index'
import { signReleaseAsOwner } from '../releases/index'
import { signatureInputSchema } from '@shared/schemas/releases'
import type { VehicleChanges } from '../vehicles/index'
import { readKey } from './owner-keys'
import { linkByHash, linkStatus, type OwnerLinkRow } from './owner.queries'
import { recordDecision } from './owner-decision.service'
import { ownerPage, ownerQuote } from './owner-page.service'
import type { PublicThrottle } from './public-throttle'

export interface OwnerRouterDeps {
  changes: VehicleChanges
  files: FileStore
  map: MapConfig
  throttle: PublicThrottle
  /** "Pay by card": the hosted card page (server/card-payments/). */
  cardPayments: CardPaymentDeps
}

const GONE = {
  expired: () => new AppError(410, 'This link has expired. Ask the yard for a new one.', said('ownerLinkExpired')),
  revoked: () => new AppError(410, 'The yard has withdrawn this link. Ask them for a new one.', said('ownerLinkWithdrawn')),
}

/**
 * /api/owner/:key — the owner's page, public (no account): the key (the link's token or its short
 * code) is the only credential and reaches one vehicle. Every route finds the link first; a wrong,
 * expired or withdrawn key counts against the address's tries (public-throttle.ts).
 */
export function ownerRouter({ changes, files, map, throttle, cardPayments }: OwnerRouterDeps): Router {
  const { db } = changes
  const router = Router()

  async function linkOf(req: Request, res: Response): Promise<{ link: OwnerLinkRow; key: string }> {
    const { key } = ownerKeyParamsSchema.parse(req.params)
    const ip = req.ip ?? ''
    await throttle.check('owner-key', ip, res)
    const read = readKey(key)
    const link = read ? await linkByHash(db, read.column, read.hash) : undefined
    const status = link ? linkStatus(link, new Date()) : null
    if (link && status === 'active') return { link, key }
    await throttle.count('owner-key', ip)
    if (!link || status === 'active') throw notFound('That link')
    throw GONE[status!]()
  }

  // An owner page's answers are for one person: never kept by a shared cache.
  router.use((_req, res, next) => {
    res.setHeader('Cache-Control', 'private, no-store')
    next()
  })

  router.get('/:key', async (req, res) => {
    const { link, key } = await linkOf(req, res)
    res.json(await ownerPage(db, link.vehicleId, key, map, link.expiresAt, new Date(), !!cardPayments.cards))
  })

  router.get('/:key/quote', async (req, res) => {
    const { link } = await linkOf(req, res)
    const { date } = ownerQuoteQuerySchema.parse(req.query)
    res.json(await ownerQuote(db, link.vehicleId, date))
  })

  router.post('/:key/decision', async (req, res) => {
    const { link, key } = await linkOf(req, res)
    const input = ownerDecisionInputSchema.parse(req.body)
    await recordDecision(changes, link, input, { ip: req.ip ?? '', userAgent: req.get('user-agent') ?? null })
    res.status(201).json(await ownerPage(db, link.vehicleId, key, map, link.expiresAt, new Date(), !!cardPayments.cards))
  })

  // What is due, paid on the payment service's hosted page; recorded only by its signed webhook.
  router.post('/:key/card-checkout', async (req, res) => {
    const { link } = await linkOf(req, res)
    const checkout = await startOwnerCheckout(cardPayments, req, link, req.body)
    res.status(checkout.replayed ? 200 : 201).json({ checkout })
  })

  // The release signed from the owner's page, where the counter's rules allow it (server/releases/owner-signature.service.ts).
  router.post('/:key/release-signature', async (req, res) => {
    const { link, key } = await linkOf(req, res)
    await signReleaseAsOwner(changes, files, link, signatureInputSchema.parse(req.body), { ip: req.ip ?? '' })
    res.status(201).json(await ownerPage(db, link.vehicleId, key, map, link.expiresAt, new Date(), !!cardPayments.cards))
  })

  const photo = (thumb: boolean) => async (req: Request, res: Response) => {
    const { link } = await linkOf(req, res)
    const { fileId } = ownerFileParamsSchema.parse(req.params)
    await sendVehicleFile(db, files, req, res, { vehicleId: link.vehicleId, fileId, thumb, kinds: ['photo'] })
  }
  router.get('/:key/files/:fileId', photo(false))
  router.get('/:key/files/:fileId/thumb', photo(true))
  return router
}
