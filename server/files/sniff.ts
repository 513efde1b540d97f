import { FIELD_WHAT, type FieldWhat } from '@shared/schemas/field-messages'
import { ACCEPTED_TYPES, MAX_FILE_BYTES, type FileKind } from '@shared/schemas/files'
import type { FileRefusal } from './refusal'

export type Sniffed = { ok: true; mime: string } | ({ ok: false } & FileRefusal)

// What to use instead, by the kind of file asked for: a key of `fields.what`, its English in FIELD_WHAT.
const USE: Record<FileKind, FieldWhat> = { photo: 'photoTypes', id: 'imageOrPdfTypes', document: 'imageOrPdfTypes' }

// SVG is text, so byte sniffing sees no type; it is refused by name too, since it can carry script.
const looksLikeSvg = (data: Buffer) => /<svg[\s>]/i.test(data.subarray(0, 4096).toString('latin1'))

/** What the file is, from its bytes alone: the name and the browser's Content-Type are not trusted. */
export async function sniff(data: Buffer, kind: FileKind): Promise<Sniffed> {
  const what = USE[kind]
  const use = FIELD_WHAT[what]
  if (data.length === 0) return { ok: false, code: 'files.empty', message: 'The file is empty.' }
  const mb = MAX_FILE_BYTES / 1024 / 1024
  if (data.length > MAX_FILE_BYTES) return { ok: false, code: 'files.overSize', message: `The file is larger than ${mb} MB.`, params: { mb } }
  if (looksLikeSvg(data)) return { ok: false, code: 'files.svg', message: `SVG drawings are not accepted (they can carry scripts). Use ${use}.`, params: { what } }
  // Loaded at the first upload, not at start-up: its modules are a tenth of a warm start.
  const { fileTypeFromBuffer } = await import('file-type')
  const type = await fileTypeFromBuffer(data)
  if (!type) return { ok: false, code: 'files.notImageOrPdf', message: `The file's contents are not an image or a PDF, whatever its name says. Use ${use}.`, params: { what } }
  if (!ACCEPTED_TYPES[kind].includes(type.mime)) {
    const shown = type.ext.toUpperCase()
    return { ok: false, code: 'files.wrongType', message: `The file's contents are ${shown} (${type.mime}), whatever its name says. Use ${use}.`, params: { type: shown, mime: type.mime, what } }
  }
  return { ok: true, mime: type.mime }
}
