import { Router } from 'express'
import type { Database } from '../../db/client'
import { getBoard } from './board.service'

export function boardRouter(db: Database): Router {
  const router = Router()
  router.get('/', async (req, res) => {
    res.json(await getBoard(db, req.user!.id))
  })
  return router
}
