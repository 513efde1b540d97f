import { writeFileSync } from 'node:fs'
import { BarcodeFormat, DataMatrixWriter, EncodeHintType } from '@zxing/library'
import QRCode from 'qrcode'

const FORCE_SQUARE = 1

/**
 * A Y4M video of one Data Matrix symbol on white, for Chromium's fake camera
 * (--use-file-for-fake-video-capture): what a phone held to a door-jamb VIN label sees.
 */
export function writeDataMatrixVideo(file: string, text: string, width = 640, height = 480, modulePx = 12) {
  // At its natural size, one pixel a module: the writer's own scaling leaves a non-integer size blank.
  const symbol = new DataMatrixWriter().encode(text, BarcodeFormat.DATA_MATRIX, 0, 0, new Map([[EncodeHintType.DATA_MATRIX_SHAPE, FORCE_SQUARE]]))
  const luma = Buffer.alloc(width * height, 235)
  const left = (width - symbol.getWidth() * modulePx) >> 1
  const top = (height - symbol.getHeight() * modulePx) >> 1
  for (let y = 0; y < symbol.getHeight() * modulePx; y++) {
    for (let x = 0; x < symbol.getWidth() * modulePx; x++) {
      if (symbol.get(Math.floor(x / modulePx), Math.floor(y / modulePx))) luma[(top + y) * width + left + x] = 16
    }
  }
  // 4:2:0 chroma at its neutral value: a grey picture.
  const chroma = Buffer.alloc((width / 2) * (height / 2) * 2, 128)
  const frame = Buffer.concat([Buffer.from('FRAME\n'), luma, chroma])
  writeFileSync(file, Buffer.concat([Buffer.from(`YUV4MPEG2 W${width} H${height} F10:1 Ip A1:1 C420jpeg\n`), frame, frame]))
}

/**
 * A Y4M video of one QR code on white (a gate pass held to the phone), for the same fake camera. The
 * frames show it at a few sizes, as a hand moves.
 */
export function writeQrVideo(file: string, text: string, width = 640, height = 480, modulePixels: number[] = [8, 7, 9, 6]) {
  // The qrcode package the printed pass uses, error correction M; the white round it is the quiet zone.
  const modules = QRCode.create(text, { errorCorrectionLevel: 'M' }).modules
  const chroma = Buffer.alloc((width / 2) * (height / 2) * 2, 128)
  const frames = modulePixels.map((modulePx) => {
    const luma = Buffer.alloc(width * height, 235)
    const left = (width - modules.size * modulePx) >> 1
    const top = (height - modules.size * modulePx) >> 1
    for (let y = 0; y < modules.size * modulePx; y++) {
      for (let x = 0; x < modules.size * modulePx; x++) {
        if (modules.get(Math.floor(y / modulePx), Math.floor(x / modulePx))) luma[(top + y) * width + left + x] = 16
      }
    }
    return Buffer.concat([Buffer.from('FRAME\n'), luma, chroma])
  })
  writeFileSync(file, Buffer.concat([Buffer.from(`YUV4MPEG2 W${width} H${height} F10:1 Ip A1:1 C420jpeg\n`), ...frames.flatMap((f) => [f, f])]))
}
