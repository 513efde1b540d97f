import { z } from 'zod'
import { text } from './fields'
import { msg } from './field-messages'

// Limits both sides check: the client before sending, the server (multer) while receiving.
export const MAX_FILE_BYTES = 20 * 1024 * 1024
export const MAX_FILES_PER_REQUEST = 12
export const MAX_FILES_PER_VEHICLE = 80
// What one upload may cost the server to open (issue 13 item 5): a PDF of a few pages has tens or
// hundreds of objects; a crafted one of 400,000 took 50 s and 400 MB to parse.
export const MAX_PDF_OBJECTS = 20_000
export const MAX_PDF_PAGES = 100
/** Uploads one person may have in progress at once; the next waits for one of them to finish. */
export const MAX_UPLOADS_IN_PROGRESS_PER_USER = 2

export const FILE_KINDS = ['photo', 'id', 'document'] as const
export type FileKind = (typeof FILE_KINDS)[number]
export const FILE_KIND_LABELS: Record<FileKind, string> = { photo: 'Photo', id: 'ID', document: 'Document' }

/** What each kind accepts, as sniffed from the bytes; photos are images only, papers may be PDF. */
export const ACCEPTED_TYPES: Record<FileKind, readonly string[]> = {
  photo: ['image/jpeg', 'image/png', 'image/webp', 'image/heic', 'image/heif'],
  id: ['image/jpeg', 'image/png', 'image/webp', 'image/heic', 'image/heif', 'application/pdf'],
  document: ['image/jpeg', 'image/png', 'image/webp', 'image/heic', 'image/heif', 'application/pdf'],
}

export const uploadFieldsSchema = z.object({
  kind: z.enum(FILE_KINDS, { error: msg('files.choosePhotoIdDocument', 'Choose photo, ID or document.') }).default('photo'),
  label: text().trim().max(120, msg('files.keepCaptionUnder120', 'Keep the caption under 120 characters.')).nullish().transform((v) => v || null),
})

export const fileRecordSchema = z.object({
  id: z.uuid(),
  kind: z.enum(FILE_KINDS),
  mime: z.string(),
  bytes: z.number(),
  width: z.number().nullable(),
  height: z.number().nullable(),
  label: z.string().nullable(),
  sha256: z.string(),
  url: z.string(),
  thumbUrl: z.string().nullable(),
  uploadedBy: z.string().nullable(),
  createdAt: z.string(),
})
export type FileRecord = z.infer<typeof fileRecordSchema>

export const filesAddedSchema = z.object({ files: z.array(fileRecordSchema) })

export function formatBytes(bytes: number): string {
  if (bytes < 1024) return `${bytes} bytes`
  if (bytes < 1024 * 1024) return `${Math.round(bytes / 1024)} KB`
  return `${(bytes / (1024 * 1024)).toFixed(1)} MB`
}
