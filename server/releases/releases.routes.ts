import { Router } from 'express'
import { claimantInputSchema, formatGateCode, gatePassKeySchema, handoverInputSchema, signatureInputSchema } from '@shared/schemas/releases'
import { vehicleParamsSchema } from '@shared/schemas/vehicles'
import { publicBase, sendPdf } from '../documents/index'
import { receiveFiles, type FileStore } from '../files/index'
import type { VehicleChanges } from '../vehicles/index'
import { checkPass, issueGatePass, recordOut } from './gate-passes.service'
import { gatePassPdf, releaseFormPdf } from './release-form.service'
import { addIdPhoto, addReleasePhotos, recordClaimant, recordHandover, releasePage, signRelease } from './releases.service'
import { documentLanguageQuerySchema } from '@shared/schemas/fields'


export interface ReleaseDeps {
  changes: VehicleChanges
  files: FileStore
  publicUrl?: string
}

/** Mounted at /api/vehicles/:vehicleId/release: the counter's release of one vehicle. */
export function releasesRouter({ changes, files, publicUrl }: ReleaseDeps): Router {
  const { db } = changes
  const router = Router({ mergeParams: true })
  const page = async (userId: Parameters<typeof releasePage>[1], vehicleId: string) => releasePage(db, userId, vehicleId)
  router.get('/', async (req, res) => {
    const { vehicleId } = vehicleParamsSchema.parse(req.params)
    res.json(await page(req.user!, vehicleId))
  })
  router.put('/claimant', async (req, res) => {
    const { vehicleId } = vehicleParamsSchema.parse(req.params)
    await recordClaimant(changes, req.user!, vehicleId, claimantInputSchema.parse(req.body))
    res.json(await page(req.user!, vehicleId))
  })
  router.post('/id-photo', receiveFiles('files'), async (req, res) => {
    const { vehicleId } = vehicleParamsSchema.parse(req.params)
    await addIdPhoto(changes, files, req.user!, vehicleId, (req.files as Express.Multer.File[] | undefined) ?? [])
    res.status(201).json(await page(req.user!, vehicleId))
  })
  router.post('/photos', receiveFiles('files'), async (req, res) => {
    const { vehicleId } = vehicleParamsSchema.parse(req.params)
    await addReleasePhotos(changes, files, req.user!, vehicleId, (req.files as Express.Multer.File[] | undefined) ?? [])
    res.status(201).json(await page(req.user!, vehicleId))
  })
  router.put('/handover', async (req, res) => {
    const { vehicleId } = vehicleParamsSchema.parse(req.params)
    await recordHandover(changes, req.user!, vehicleId, handoverInputSchema.parse(req.body))
    res.json(await page(req.user!, vehicleId))
  })
  router.post('/signature', async (req, res) => {
    const { vehicleId } = vehicleParamsSchema.parse(req.params)
    await signRelease(changes, files, req.user!, vehicleId, signatureInputSchema.parse(req.body))
    res.status(201).json(await page(req.user!, vehicleId))
  })
  router.get('/form', async (req, res) => {
    const { vehicleId } = vehicleParamsSchema.parse(req.params)
    const { lang } = documentLanguageQuerySchema.parse(req.query)
    const { pdf, stockNumber } = await releaseFormPdf(db, files, req.user!, vehicleId, lang)
    sendPdf(res, pdf, `release-${stockNumber}.pdf`)
  })
  router.post('/gate-pass', async (req, res) => {
    const { vehicleId } = vehicleParamsSchema.parse(req.params)
    const { lang } = documentLanguageQuerySchema.parse(req.query)
    const pass = await issueGatePass(changes, req.user!, vehicleId)
    const pdf = await gatePassPdf(db, req.user!, vehicleId, pass, publicBase(req, publicUrl), lang)
    res.status(201).json({ id: pass.id, code: formatGateCode(pass.code), expiresAt: pass.expiresAt.toISOString(), pdf: Buffer.from(pdf).toString('base64') })
  })
  return router
}

/** Mounted at /api/gate: the gate's phone reads a pass, shows the vehicle, records it out. */
export function gateRouter(changes: VehicleChanges): Router {
  const router = Router()
  router.post('/check', async (req, res) => {
    res.json(await checkPass(changes.db, req.user!, gatePassKeySchema.parse(req.body).pass))
  })
  router.post('/record-out', async (req, res) => {
    res.json(await recordOut(changes, req.user!, gatePassKeySchema.parse(req.body).pass))
  })
  return router
}
