import { Router } from 'express'
import type { Database } from '@db/client'
import { outboxAttachmentParamsSchema, outboxMessageParamsSchema, outboxQuerySchema } from '@shared/schemas/outbox'
import { notFound } from '../errors'
import { type FileStore } from '../files/index'
import { yardOfUser } from '../yards/index'
import { attachmentOf } from './outbox.queries'
import { storedFileBytes } from './stored-file'
import { outboxMessage, outboxPage, retryFailed } from './outbox.service'

export interface OutboxDeps {
  db: Database
  files: FileStore
  /** Tells this server's worker that a job is waiting (absent when no worker runs, as in most tests). */
  kick?: () => void
}

/** /api/outbox: what was sent, what waits, what failed; a failed message can be sent again. */
export function outboxRouter({ db, files, kick }: OutboxDeps): Router {
  const router = Router()
  const scopeOf = async (userId: string) => {
    const yard = await yardOfUser(db, userId)
    if (!yard) throw notFound('A yard for your company')
    return { companyId: yard.companyId, yardId: yard.id }
  }
  router.get('/', async (req, res) => {
    const q = outboxQuerySchema.parse(req.query)
    res.json(await outboxPage(db, await scopeOf(req.user!.id), q.status, q.page, q.pageSize))
  })
  router.get('/:messageId', async (req, res) => {
    const { messageId } = outboxMessageParamsSchema.parse(req.params)
    res.json(await outboxMessage(db, await scopeOf(req.user!.id), messageId))
  })
  router.get('/:messageId/attachments/:attachmentId', async (req, res) => {
    const { messageId, attachmentId } = outboxAttachmentParamsSchema.parse(req.params)
    const a = await attachmentOf(db, await scopeOf(req.user!.id), messageId, attachmentId)
    if (!a) throw notFound('That attachment')
    const body = a.content ?? (await storedFileBytes(db, files, a.fileId!))
    if (!body) throw notFound('That attachment')
    // Only a PDF opens in the browser; anything else is a download, and nothing attached may run as a page.
    const inline = a.contentType === 'application/pdf'
    res.setHeader('Content-Security-Policy', "sandbox; default-src 'none'")
    res.setHeader('Cache-Control', 'private, no-cache')
    res.attachment(a.filename)
    if (inline) res.setHeader('Content-Disposition', res.getHeader('Content-Disposition')!.toString().replace(/^attachment/, 'inline'))
    res.type(inline ? 'application/pdf' : 'application/octet-stream').send(body)
  })
  router.post('/:messageId/retry', async (req, res) => {
    const { messageId } = outboxMessageParamsSchema.parse(req.params)
    const message = await retryFailed(db, await scopeOf(req.user!.id), messageId, req.user!.id)
    kick?.()
    res.json(message)
  })
  return router
}
