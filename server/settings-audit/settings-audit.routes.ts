import { Router } from 'express'
import type { Database } from '@db/client'
import { settingsAuditQuerySchema } from '@shared/schemas/settings-audit'
import { companyOf } from '../users/index'
import { listSettingsChanges } from './settings-audit.queries'

export function settingsAuditRouter(db: Database): Router {
  const router = Router()
  router.get('/', async (req, res) => {
    const { page, pageSize } = settingsAuditQuerySchema.parse(req.query)
    res.json(await listSettingsChanges(db, await companyOf(db, req.user!.id), page, pageSize))
  })
  return router
}
