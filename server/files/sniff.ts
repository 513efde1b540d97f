import { fileTypeFromBuffer } from 'file-type'
import { ACCEPTED_TYPES, MAX_FILE_BYTES, type FileKind } from '@shared/schemas/files'

export type Sniffed = { ok: true; mime: string } | { ok: false; message: string }

const WORDS: Record<FileKind, string> = {
  photo: 'JPEG, PNG, WebP or HEIC photos',
  id: 'JPEG, PNG, WebP or HEIC images or PDF files',
  document: 'JPEG, PNG, WebP or HEIC images or PDF files',
}

// SVG is text, so byte sniffing sees no type; it is refused by name too, since it can carry script.
const looksLikeSvg = (data: Buffer) => /<svg[\s>]/i.test(data.subarray(0, 4096).toString('latin1'))

/** What the file is, from its bytes alone: the name and the browser's Content-Type are not trusted. */
export async function sniff(data: Buffer, kind: FileKind): Promise<Sniffed> {
  if (data.length === 0) return { ok: false, message: 'The file is empty.' }
  if (data.length > MAX_FILE_BYTES) return { ok: false, message: `The file is larger than ${MAX_FILE_BYTES / 1024 / 1024} MB.` }
  if (looksLikeSvg(data)) return { ok: false, message: `SVG drawings are not accepted (they can carry scripts). Use ${WORDS[kind]}.` }
  const type = await fileTypeFromBuffer(data)
  if (!type) return { ok: false, message: `The file's contents are not an image or a PDF, whatever its name says. Use ${WORDS[kind]}.` }
  if (!ACCEPTED_TYPES[kind].includes(type.mime)) {
    return { ok: false, message: `The file's contents are ${type.ext.toUpperCase()} (${type.mime}), whatever its name says. Use ${WORDS[kind]}.` }
  }
  return { ok: true, mime: type.mime }
}
