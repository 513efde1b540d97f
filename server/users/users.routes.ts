import { Router } from 'express'
import { z } from 'zod'
import type { Database } from '@db/client'
import { msg } from '@shared/schemas/field-messages'
import type { BoardNotifier } from '../live/index'
import { createUserSchema, resetPasswordSchema, staffYardsSchema, updateUserSchema } from '@shared/schemas/users'
import { refusingCommonPasswords } from './common-passwords'
import * as service from './users.service'

const newUserSchema = refusingCommonPasswords(createUserSchema)
const newPasswordSchema = refusingCommonPasswords(resetPasswordSchema)
const idParam = z.object({ id: z.uuid({ error: msg('common.thatNotUserId', 'That is not a valid user id.') }) })

/** `boards` ends the open board streams of a user whose sessions a change ends. */
export function usersRouter(db: Database, boards: BoardNotifier): Router {
  const router = Router()
  router.get('/', async (req, res) => {
    res.json({ users: await service.listUsers(db, req.user!) })
  })
  router.post('/', async (req, res) => {
    const input = newUserSchema.parse(req.body)
    res.status(201).json({ user: await service.createUser(db, req.user!, input) })
  })
  router.patch('/:id', async (req, res) => {
    const { id } = idParam.parse(req.params)
    const input = updateUserSchema.parse(req.body)
    res.json({ user: await service.changeUser(db, boards, req.user!, id, input) })
  })
  router.put('/:id/yards', async (req, res) => {
    const { id } = idParam.parse(req.params)
    const input = staffYardsSchema.parse(req.body)
    const user = await service.setStaffYards(db, req.user!, id, input)
    // Their open board streams (each of one yard) end on every app server; the board reopens on a yard still theirs.
    await boards.sessionsEnded({ userId: id })
    res.json({ user })
  })
  router.post('/:id/password', async (req, res) => {
    const { id } = idParam.parse(req.params)
    const { password } = newPasswordSchema.parse(req.body)
    await service.resetPassword(db, boards, req.user!, id, password)
    res.status(204).end()
  })
  return router
}
