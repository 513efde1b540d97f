import type { RequestHandler } from 'express'
import multer from 'multer'
import { MAX_FILE_BYTES, MAX_FILES_PER_REQUEST } from '@shared/schemas/files'
import { AppError } from '../errors'

const MB = MAX_FILE_BYTES / 1024 / 1024

const MESSAGES: Record<string, [number, string]> = {
  LIMIT_FILE_SIZE: [413, `A file is larger than ${MB} MB. Nothing was saved.`],
  LIMIT_FILE_COUNT: [413, `At most ${MAX_FILES_PER_REQUEST} files at a time. Nothing was saved.`],
  LIMIT_UNEXPECTED_FILE: [400, `At most ${MAX_FILES_PER_REQUEST} files at a time, sent as the form's files. Nothing was saved.`],
  LIMIT_PART_COUNT: [413, 'The form has too many parts. Nothing was saved.'],
  LIMIT_FIELD_VALUE: [413, 'A form field is too long. Nothing was saved.'],
  LIMIT_FIELD_COUNT: [413, 'The form has too many fields. Nothing was saved.'],
}

/**
 * Receives up to MAX_FILES_PER_REQUEST files of at most MAX_FILE_BYTES each into memory (they are
 * re-encoded before anything is written), refusing with a plain message when a limit is passed.
 */
export function receiveFiles(field: string): RequestHandler {
  const parse = multer({
    storage: multer.memoryStorage(),
    limits: { fileSize: MAX_FILE_BYTES, files: MAX_FILES_PER_REQUEST, fields: 8, fieldSize: 256 * 1024, parts: MAX_FILES_PER_REQUEST + 8 },
  }).array(field, MAX_FILES_PER_REQUEST)
  return (req, res, next) => {
    parse(req, res, (err: unknown) => {
      if (!err) return next()
      if (err instanceof multer.MulterError) {
        const [status, message] = MESSAGES[err.code] ?? [400, 'The upload was refused. Nothing was saved.']
        return next(new AppError(status, message, { issues: [{ path: field, message }] }))
      }
      next(err)
    })
  }
}
