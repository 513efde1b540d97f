import { SIGNATURE_PREFIX } from '@shared/schemas/releases'
import { badRequest, fieldIssue } from '../errors'
import { loadSharp } from '../files/index'

const UNREADABLE = 'The signature could not be read as an image. Sign again.'
const EMPTY = 'The signature box is empty: the person collecting signs in the box, then presses Save.'
// A few strokes of a pen are thousands of dark pixels; a tap or a speck of dust is not a signature.
const MIN_INK_PIXELS = 150

/**
 * The pad's PNG, refused when it is not a PNG or carries no signature. Ink is counted on the image
 * flattened onto white, so a transparent pad and a white one are judged alike.
 */
export async function signatureImage(dataUrl: string): Promise<Buffer> {
  const png = Buffer.from(dataUrl.slice(SIGNATURE_PREFIX.length), 'base64')
  const sharp = await loadSharp()
  let pixels: Buffer
  try {
    pixels = await sharp(png, { limitInputPixels: 4_000_000 }).flatten({ background: '#ffffff' }).greyscale().raw().toBuffer()
  } catch {
    throw badRequest(UNREADABLE, [fieldIssue('image', 'releases.signatureUnreadable', UNREADABLE)])
  }
  let ink = 0
  for (const value of pixels) if (value < 128) ink++
  if (ink < MIN_INK_PIXELS) throw badRequest(EMPTY, [fieldIssue('image', 'releases.signatureEmpty', EMPTY)])
  return png
}
