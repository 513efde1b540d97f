import { createHash } from 'node:crypto'
import type { FileKind } from '@shared/schemas/files'
import { badRequest, fieldIssue, type Issue } from '../errors'
import { reencodeImage, UnreadableImageError } from './images'
import { cleanPdf, CostlyPdfError, UnreadablePdfError } from './pdfs'
import type { FileRefusal } from './refusal'
import { sniff } from './sniff'

export interface Incoming {
  buffer: Buffer
  originalname: string
}

export interface PreparedFile {
  kind: FileKind
  mime: 'image/jpeg' | 'application/pdf'
  ext: 'jpg' | 'pdf'
  data: Buffer
  thumb: Buffer | null
  width: number | null
  height: number | null
  sha256: string
  label: string | null
}

// Only to name the file in a message: the browser's name is never used to store or serve anything.
const shownName = (name: string) => name.replace(/[^\p{L}\p{N} ._()-]/gu, '').slice(0, 60) || 'a file'

async function prepareOne(file: Incoming, kind: FileKind, label: string | null): Promise<PreparedFile | FileRefusal> {
  const type = await sniff(file.buffer, kind)
  if (!type.ok) return type
  const sha = (data: Buffer) => createHash('sha256').update(data).digest('hex')
  if (type.mime === 'application/pdf') {
    try {
      const data = await cleanPdf(file.buffer)
      return { kind, mime: 'application/pdf', ext: 'pdf', data, thumb: null, width: null, height: null, sha256: sha(data), label }
    } catch (err) {
      if (err instanceof CostlyPdfError) return { code: err.code, message: err.message, params: err.params }
      if (err instanceof UnreadablePdfError) return { code: 'files.pdfUnreadable', message: 'The PDF could not be read: it may be damaged or password-protected.' }
      throw err
    }
  }
  const heic = type.mime === 'image/heic' || type.mime === 'image/heif'
  try {
    const img = await reencodeImage(file.buffer, heic ? 'heic' : 'other')
    return { kind, mime: 'image/jpeg', ext: 'jpg', data: img.data, thumb: img.thumb, width: img.width, height: img.height, sha256: sha(img.data), label }
  } catch (err) {
    if (!(err instanceof UnreadableImageError)) throw err
    if (heic) {
      return {
        code: 'files.heicUnreadable',
        message: "This HEIC photo could not be read: it may be damaged or too large. On the phone, set the camera to 'Most compatible' or share the photo as JPEG, then add it again.",
      }
    }
    return { code: 'files.imageUnreadable', message: 'The image could not be read: it may be damaged, cut short or too large to open.' }
  }
}

/**
 * Sniffs, re-encodes and hashes every file before anything is stored; one refusal refuses the lot,
 * with a message per file naming it (its code and `name` beside the English), so a request either adds
 * all its files or none.
 */
export async function prepareUploads(files: Incoming[], kind: FileKind, field: string, label: string | null = null): Promise<PreparedFile[]> {
  const prepared: PreparedFile[] = []
  const issues: Issue[] = []
  // One at a time: decoding a dozen phone photos at once would take every core and a lot of memory.
  for (const [i, file] of files.entries()) {
    const result = await prepareOne(file, kind, label)
    if ('data' in result) prepared.push(result)
    else {
      const name = shownName(file.originalname)
      issues.push(fieldIssue(`${field}.${i}`, result.code, `${name}: ${result.message}`, { name, ...result.params }))
    }
  }
  if (issues.length > 0) {
    throw badRequest(issues.length === 1 ? issues[0]!.message : `${issues.length} files were refused; nothing was saved.`, issues)
  }
  return prepared
}
