import type { RequestHandler } from 'express'
import multer from 'multer'
import { MAX_FILE_BYTES, MAX_FILES_PER_REQUEST, MAX_UPLOADS_IN_PROGRESS_PER_USER } from '@shared/schemas/files'
import { AppError, fieldIssue } from '../errors'
import type { FileRefusal } from './refusal'

const MB = MAX_FILE_BYTES / 1024 / 1024
const max = MAX_FILES_PER_REQUEST

// Each refusal's status, and its English beside its code (`fields.files.*`) and parameters.
type Refused = [number, FileRefusal]
const MESSAGES: Record<string, Refused> = {
  LIMIT_FILE_SIZE: [413, { code: 'files.tooLarge', message: `A file is larger than ${MB} MB. Nothing was saved.`, params: { mb: MB } }],
  LIMIT_FILE_COUNT: [413, { code: 'files.tooMany', message: `At most ${max} files at a time. Nothing was saved.`, params: { max } }],
  LIMIT_UNEXPECTED_FILE: [400, { code: 'files.tooManyInForm', message: `At most ${max} files at a time, sent as the form's files. Nothing was saved.`, params: { max } }],
  LIMIT_PART_COUNT: [413, { code: 'files.tooManyParts', message: 'The form has too many parts. Nothing was saved.' }],
  LIMIT_FIELD_VALUE: [413, { code: 'files.fieldTooLong', message: 'A form field is too long. Nothing was saved.' }],
  LIMIT_FIELD_COUNT: [413, { code: 'files.tooManyFields', message: 'The form has too many fields. Nothing was saved.' }],
}
const REFUSED: Refused = [400, { code: 'files.uploadRefused', message: 'The upload was refused. Nothing was saved.' }]
const INCOMPLETE: Refused = [400, { code: 'files.incomplete', message: 'The form arrived incomplete. Add the files again. Nothing was saved.' }]
const BAD_NAME: Refused = [
  400,
  { code: 'files.badName', message: 'A file name holds a character that is not allowed (a control character such as NUL). Rename the file and add it again. Nothing was saved.' },
]
const BUSY: Refused = [
  429,
  {
    code: 'files.busy',
    message: `Your earlier uploads are still being received or checked (at most ${MAX_UPLOADS_IN_PROGRESS_PER_USER} at a time). Wait for one to finish, then add these again. Nothing was saved.`,
    params: { max: MAX_UPLOADS_IN_PROGRESS_PER_USER },
  },
]
// A control character has no place in a file name; busboy refuses a NUL in a part header itself.
const hasControl = (name: string) => [...name].some((c) => c.charCodeAt(0) < 0x20 || c.charCodeAt(0) === 0x7f)

// Uploads in progress per user in this process: each holds up to 12 × 20 MB in memory while it is checked.
const inProgress = new Map<string, number>()

/** How many uploads this user has in progress (tests wait on it). */
export const uploadsInProgress = (userId: string) => inProgress.get(userId) ?? 0

/**
 * Receives up to MAX_FILES_PER_REQUEST files of at most MAX_FILE_BYTES each into memory (they are
 * re-encoded before anything is written), refusing with a plain message when a limit is passed,
 * and at most MAX_UPLOADS_IN_PROGRESS_PER_USER at once from one person (429 beyond that).
 */
export function receiveFiles(field: string): RequestHandler {
  const parse = multer({
    storage: multer.memoryStorage(),
    limits: { fileSize: MAX_FILE_BYTES, files: MAX_FILES_PER_REQUEST, fields: 8, fieldSize: 256 * 1024, parts: MAX_FILES_PER_REQUEST + 8 },
  }).array(field, MAX_FILES_PER_REQUEST)
  const refuse = ([status, { code, message, params }]: Refused) => new AppError(status, message, { issues: [fieldIssue(field, code, message, params)] })
  return (req, res, next) => {
    const userId = req.user?.id
    if (userId) {
      if (uploadsInProgress(userId) >= MAX_UPLOADS_IN_PROGRESS_PER_USER) {
        res.setHeader('Retry-After', '5')
        return next(refuse(BUSY))
      }
      inProgress.set(userId, uploadsInProgress(userId) + 1)
      // Counted until the answer is sent or the connection drops, whichever comes first.
      res.once('close', () => {
        const left = uploadsInProgress(userId) - 1
        if (left > 0) inProgress.set(userId, left)
        else inProgress.delete(userId)
      })
    }
    parse(req, res, (err: unknown) => {
      if (!err) {
        const files = (req.files as Express.Multer.File[] | undefined) ?? []
        if (files.some((f) => hasControl(f.originalname))) return next(refuse(BAD_NAME))
        return next()
      }
      if (err instanceof multer.MulterError) {
        return next(refuse(MESSAGES[err.code] ?? REFUSED))
      }
      // busboy's own refusals of a malformed form: a NUL in a part header, a cut-short body.
      if (err instanceof Error && /^(Malformed part header|Unexpected end of form|Multipart: Boundary not found)/.test(err.message)) {
        return next(refuse(err.message.startsWith('Malformed part header') ? BAD_NAME : INCOMPLETE))
      }
      next(err)
    })
  }
}
