import { createRequire } from 'node:module'

interface HeicImage {
  width: number
  height: number
  decode(): Promise<{ width: number; height: number; data: Uint8ClampedArray }>
}
type DecodeAll = (input: { buffer: Uint8Array }) => Promise<HeicImage[] & { dispose(): void }>

// heic-decode wraps libheif compiled to WebAssembly (several MB): loaded on the first HEIC photo.
let decodeAll: DecodeAll | undefined
const library = () => (decodeAll ??= (createRequire(import.meta.url)('heic-decode') as { all: DecodeAll }).all)

/** RGBA pixels of a HEIC/HEIF photo's primary image, turned upright as the file says. */
export interface DecodedHeic {
  data: Buffer
  width: number
  height: number
}

/**
 * Decodes a phone's HEIC photo, which the image library's prebuilt binaries cannot read (they
 * leave the HEVC codec out). The size is checked before the pixels are: `maxPixels` refuses a bomb.
 */
export async function decodeHeic(input: Buffer, maxPixels: number): Promise<DecodedHeic> {
  const images = await library()({ buffer: input })
  try {
    const primary = images[0]!
    if (primary.width * primary.height > maxPixels) throw new Error(`${primary.width}×${primary.height} is too large to open`)
    const { data, width, height } = await primary.decode()
    return { data: Buffer.from(data.buffer, data.byteOffset, data.byteLength), width, height }
  } finally {
    images.dispose()
  }
}
