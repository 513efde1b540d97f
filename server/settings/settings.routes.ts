import { Router } from 'express'
import { z } from 'zod'
import type { Database } from '@db/client'
import { vehicleParamsSchema } from '@shared/schemas/vehicles'
import { chooseRuleSetSchema, copyRuleSetSchema, moveToLatestVersionSchema, saveRuleSetSchema } from '@shared/schemas/rule-set-editor'
import type { VehicleChanges } from '../vehicles/index'
import { chooseYardRuleSet, copyRuleSet, ruleSetForSettings, ruleSetsForSettings, saveRuleSet } from './rule-set-editor.service'
import { moveToLatestVersion, vehiclesOnOlderVersions } from './vehicle-rule-set.service'

const slugParam = z.object({ id: z.string().min(1).max(80) })

/** The manager's settings: the rule-set editor and which rule set the yard uses (every change audited). */
export function settingsRouter(db: Database): Router {
  const router = Router()
  router.get('/rule-sets', async (req, res) => {
    res.json({ ruleSets: await ruleSetsForSettings(db, req.user!) })
  })
  router.get('/rule-sets/:id', async (req, res) => {
    res.json(await ruleSetForSettings(db, req.user!, slugParam.parse(req.params).id))
  })
  router.post('/rule-sets/:id/copy', async (req, res) => {
    res.status(201).json(await copyRuleSet(db, req.user!, slugParam.parse(req.params).id, copyRuleSetSchema.parse(req.body)))
  })
  router.put('/rule-sets/:id', async (req, res) => {
    res.json(await saveRuleSet(db, req.user!, slugParam.parse(req.params).id, saveRuleSetSchema.parse(req.body)))
  })
  router.get('/rule-sets/:id/older-vehicles', async (req, res) => {
    res.json(await vehiclesOnOlderVersions(db, req.user!, slugParam.parse(req.params).id))
  })
  router.put('/yard-rule-set', async (req, res) => {
    res.json({ ruleSets: await chooseYardRuleSet(db, req.user!, chooseRuleSetSchema.parse(req.body)) })
  })
  return router
}

/** POST /api/vehicles/:vehicleId/rule-set-version: the vehicle moves to its yard's current rule-set version. */
export function vehicleRuleSetRouter(changes: VehicleChanges): Router {
  const router = Router({ mergeParams: true })
  router.post('/', async (req, res) => {
    const { vehicleId } = vehicleParamsSchema.parse(req.params)
    res.json(await moveToLatestVersion(changes, req.user!, vehicleId, moveToLatestVersionSchema.parse(req.body)))
  })
  return router
}
