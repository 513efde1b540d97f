import { eq } from 'drizzle-orm'
import { Router } from 'express'
import type { Database } from '@db/client'
import { users } from '@db/schema'
import { chooseYardSchema, type MyYards } from '@shared/schemas/yards'
import { notFound } from '../errors'
import { yardOfUser, yardsOfUser } from './yards.queries'

const brief = (y: { id: string; name: string; code: string; timeZone: string }) => ({ id: y.id, name: y.name, code: y.code, timeZone: y.timeZone })

export function yardsRouter(db: Database): Router {
  const router = Router()
  router.get('/current', async (req, res) => {
    const yard = await yardOfUser(db, req.user!.id)
    if (!yard) throw notFound('A yard for your company')
    res.json({ yard })
  })
  router.get('/mine', async (req, res) => {
    const [mine, current] = await Promise.all([yardsOfUser(db, req.user!.id), yardOfUser(db, req.user!.id)])
    const body: MyYards = { yards: mine.map(brief), currentId: current?.id ?? null }
    res.json(body)
  })
  // Another yard's id (or another company's) is "not found", as everywhere else.
  router.put('/current', async (req, res) => {
    const { yardId } = chooseYardSchema.parse(req.body)
    const yard = (await yardsOfUser(db, req.user!.id)).find((y) => y.id === yardId)
    if (!yard) throw notFound('That yard')
    await db.update(users).set({ currentYardId: yard.id }).where(eq(users.id, req.user!.id))
    res.json({ yard: brief(yard) })
  })
  return router
}
