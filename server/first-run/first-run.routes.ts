import { Router } from 'express'
import type { Database } from '@db/client'
import { firstRunSchema, type FirstRunState } from '@shared/schemas/first-run'
import { refusingCommonPasswords } from '../users/index'
import { firstRunNeeded, setUpFirstCompany } from './first-run.service'

const firstRunInput = refusingCommonPasswords(firstRunSchema)

/**
 * /api/first-run: public, and of use only while no company exists (afterwards the POST is 409 and
 * the GET says `needed: false`). The client signs the new manager in with the password just chosen.
 */
export function firstRunRouter(db: Database, ruleSetsFolder?: string): Router {
  const router = Router()
  router.get('/', async (_req, res) => {
    const body: FirstRunState = { needed: await firstRunNeeded(db) }
    res.json(body)
  })
  router.post('/', async (req, res) => {
    const input = firstRunInput.parse(req.body)
    res.status(201).json(await setUpFirstCompany(db, input, ruleSetsFolder))
  })
  return router
}
