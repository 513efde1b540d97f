/**
 * Reads back a message as an SMTP server received it: headers, the text and HTML bodies, and the
 * attachments' bytes. Enough MIME (RFC 2045–2047) for what nodemailer writes; for tests only.
 */
export interface ParsedMail {
  headers: Map<string, string>
  subject: string
  text: string | undefined
  html: string | undefined
  attachments: { filename: string; contentType: string; content: Buffer }[]
}

interface Part {
  headers: Map<string, string>
  body: string
}

function splitPart(raw: string): Part {
  const at = raw.indexOf('\r\n\r\n')
  const head = at === -1 ? raw : raw.slice(0, at)
  const body = at === -1 ? '' : raw.slice(at + 4)
  const headers = new Map<string, string>()
  // Folded header lines continue with whitespace (RFC 5322 §2.2.3).
  for (const line of head.replace(/\r\n[ \t]+/g, ' ').split('\r\n')) {
    const colon = line.indexOf(':')
    if (colon > 0) headers.set(line.slice(0, colon).trim().toLowerCase(), line.slice(colon + 1).trim())
  }
  return { headers, body }
}

function param(header: string | undefined, name: string): string | undefined {
  const m = header?.match(new RegExp(`${name}\\*?=("([^"]*)"|[^;\\s]+)`, 'i'))
  return m ? decodeWords(m[2] ?? m[1]!) : undefined
}

/** RFC 2047 encoded words, e.g. =?UTF-8?Q?Aviso_de_almacenaje?= */
export function decodeWords(value: string): string {
  return value.replace(/=\?([^?]+)\?([BbQq])\?([^?]*)\?=\s*/g, (_all, _charset: string, enc: string, data: string) =>
    enc.toUpperCase() === 'B'
      ? Buffer.from(data, 'base64').toString('utf8')
      : Buffer.from(data.replace(/_/g, ' ').replace(/=([0-9A-F]{2})/gi, (_h, hex: string) => String.fromCharCode(parseInt(hex, 16))), 'latin1').toString('utf8'),
  )
}

function bodyBytes(part: Part): Buffer {
  const encoding = (part.headers.get('content-transfer-encoding') ?? '7bit').toLowerCase()
  if (encoding === 'base64') return Buffer.from(part.body.replace(/\s+/g, ''), 'base64')
  if (encoding === 'quoted-printable') {
    const soft = part.body.replace(/=\r\n/g, '')
    return Buffer.from(soft.replace(/=([0-9A-F]{2})/gi, (_h, hex: string) => String.fromCharCode(parseInt(hex, 16))), 'latin1')
  }
  return Buffer.from(part.body, 'latin1')
}

function walk(part: Part, into: ParsedMail) {
  const type = part.headers.get('content-type') ?? 'text/plain'
  const boundary = param(type, 'boundary')
  if (/^multipart\//i.test(type) && boundary) {
    const pieces = part.body.split(`--${boundary}`)
    // Before the first boundary is a preamble; after the closing "--" an epilogue.
    for (const piece of pieces.slice(1)) {
      if (piece.startsWith('--')) break
      walk(splitPart(piece.replace(/^\r\n/, '').replace(/\r\n$/, '')), into)
    }
    return
  }
  const disposition = part.headers.get('content-disposition') ?? ''
  const filename = param(disposition, 'filename') ?? param(type, 'name')
  if (/^attachment/i.test(disposition) || filename) {
    into.attachments.push({ filename: filename ?? '', contentType: type.split(';')[0]!.trim(), content: bodyBytes(part) })
  } else if (/^text\/html/i.test(type)) {
    into.html = bodyBytes(part).toString('utf8')
  } else if (/^text\/plain/i.test(type)) {
    into.text = bodyBytes(part).toString('utf8')
  }
}

export function parseMail(raw: Buffer): ParsedMail {
  const root = splitPart(raw.toString('latin1'))
  const mail: ParsedMail = { headers: root.headers, subject: decodeWords(root.headers.get('subject') ?? ''), text: undefined, html: undefined, attachments: [] }
  walk(root, mail)
  return mail
}
