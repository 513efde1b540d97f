import { loadSharp } from '../files/index'
import { STREETS, type Point } from './orrin-flats'

const SIZE = 256
export const MAX_ZOOM = 19
const CACHE_LIMIT = 4000
const cache = new Map<string, Buffer>()

/** Web-Mercator pixel of a point at a zoom, the projection every slippy-map tile server uses. */
function pixel([lat, lng]: Point, z: number): [number, number] {
  const world = SIZE * 2 ** z
  const r = (lat * Math.PI) / 180
  return [((lng + 180) / 360) * world, ((1 - Math.log(Math.tan(r) + 1 / Math.cos(r)) / Math.PI) / 2) * world]
}

const escapeXml = (s: string) => s.replace(/&/g, '&amp;').replace(/</g, '&lt;')

function streetsSvg(z: number, x: number, y: number): string {
  if (z < 12) return ''
  const width = Math.min(14, Math.max(1.5, 2 ** (z - 13)))
  const ox = x * SIZE
  const oy = y * SIZE
  const lines: string[] = []
  const labels: string[] = []
  for (const street of STREETS) {
    const pts = street.points.map((p) => pixel(p, z)).map(([px, py]) => [px - ox, py - oy] as const)
    const d = pts.map(([px, py], i) => `${i === 0 ? 'M' : 'L'}${px.toFixed(1)},${py.toFixed(1)}`).join(' ')
    lines.push(`<path d="${d}" stroke="#b9b3a4" stroke-width="${width + 2}" fill="none" stroke-linecap="round" stroke-linejoin="round"/>`)
    lines.push(`<path d="${d}" stroke="#ffffff" stroke-width="${width}" fill="none" stroke-linecap="round" stroke-linejoin="round"/>`)
    if (z < 15) continue
    // A label only where it fits wholly inside this tile: neighbouring tiles never draw half of one.
    const half = street.name.length * 3.6
    for (let i = 1; i < pts.length; i++) {
      const [a, b] = [pts[i - 1]!, pts[i]!]
      const [mx, my] = [(a[0] + b[0]) / 2, (a[1] + b[1]) / 2]
      if (Math.hypot(b[0] - a[0], b[1] - a[1]) < half * 2.5) continue
      if (mx < half + 4 || mx > SIZE - half - 4 || my < 14 || my > SIZE - 14) continue
      let angle = (Math.atan2(b[1] - a[1], b[0] - a[0]) * 180) / Math.PI
      if (angle > 90) angle -= 180
      if (angle < -90) angle += 180
      labels.push(
        `<text x="${mx.toFixed(1)}" y="${my.toFixed(1)}" transform="rotate(${angle.toFixed(1)} ${mx.toFixed(1)} ${my.toFixed(1)})" ` +
          `text-anchor="middle" dominant-baseline="central" font-family="DejaVu Sans, sans-serif" font-size="11" fill="#4a5358" ` +
          `stroke="#f1eee6" stroke-width="3" paint-order="stroke">${escapeXml(street.name)}</text>`,
      )
    }
  }
  return lines.join('') + labels.join('')
}

export const validTile = (z: number, x: number, y: number) =>
  Number.isInteger(z) && Number.isInteger(x) && Number.isInteger(y) && z >= 0 && z <= MAX_ZOOM && x >= 0 && y >= 0 && x < 2 ** z && y < 2 ** z

/**
 * A plain tile drawn from the town's street list: enough to place a pin offline and in tests,
 * through the same Leaflet tile layer a real tile server would feed.
 */
export async function tile(z: number, x: number, y: number): Promise<Buffer> {
  const key = `${z}/${x}/${y}`
  const hit = cache.get(key)
  if (hit) return hit
  const svg =
    `<svg xmlns="http://www.w3.org/2000/svg" width="${SIZE}" height="${SIZE}">` +
    `<rect width="${SIZE}" height="${SIZE}" fill="#f1eee6"/>` +
    `<path d="M0,0.5H${SIZE}M0.5,0V${SIZE}" stroke="#e3ded2" stroke-width="1"/>` +
    streetsSvg(z, x, y) +
    '</svg>'
  const sharp = await loadSharp()
  const png = await sharp(Buffer.from(svg)).png({ compressionLevel: 9, palette: true }).toBuffer()
  if (cache.size >= CACHE_LIMIT) cache.delete(cache.keys().next().value!)
  cache.set(key, png)
  return png
}
