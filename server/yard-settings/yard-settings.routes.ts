import { Router } from 'express'
import type { Database } from '@db/client'
import { editYardSchema, newYardWith, spaceBlockSchema, spaceParamsSchema, yardParamsSchema } from '@shared/schemas/yard-settings'
import { addSpaces, addYard, editYard, retireSpace, ruleSetIdsFor, yardsForSettings } from './yard-settings.service'

/** /api/settings/yards: the manager's yards — details, rates, spaces (every change audited). */
export function yardSettingsRouter(db: Database, ruleSetsFolder?: string): Router {
  const router = Router()
  router.get('/', async (req, res) => {
    res.json({ yards: await yardsForSettings(db, req.user!) })
  })
  router.post('/', async (req, res) => {
    const input = newYardWith(await ruleSetIdsFor(db, req.user!, ruleSetsFolder)).parse(req.body)
    const id = await addYard(db, req.user!, input, ruleSetsFolder)
    res.status(201).json({ id })
  })
  router.patch('/:yardId', async (req, res) => {
    const { yardId } = yardParamsSchema.parse(req.params)
    await editYard(db, req.user!, yardId, editYardSchema.parse(req.body))
    res.json({ yards: await yardsForSettings(db, req.user!) })
  })
  router.post('/:yardId/spaces', async (req, res) => {
    const { yardId } = yardParamsSchema.parse(req.params)
    await addSpaces(db, req.user!, yardId, spaceBlockSchema.parse(req.body))
    res.status(201).json({ yards: await yardsForSettings(db, req.user!) })
  })
  router.post('/:yardId/spaces/:spaceId/retire', async (req, res) => {
    const { yardId, spaceId } = spaceParamsSchema.parse(req.params)
    await retireSpace(db, req.user!, yardId, spaceId)
    res.json({ yards: await yardsForSettings(db, req.user!) })
  })
  return router
}
