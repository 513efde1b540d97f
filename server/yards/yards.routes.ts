import { Router } from 'express'
import type { Database } from '@db/client'
import { notFound } from '../errors'
import { yardOfUser } from './yards.queries'

export function yardsRouter(db: Database): Router {
  const router = Router()
  router.get('/current', async (req, res) => {
    const yard = await yardOfUser(db, req.user!.id)
    if (!yard) throw notFound('A yard for your company')
    res.json({ yard })
  })
  return router
}
