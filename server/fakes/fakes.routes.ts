import { Router } from 'express'
import { z } from 'zod'
import { reverse, search } from './geocoder'
import { tile, validTile } from './tiles'

const tileParams = z.object({ z: z.coerce.number(), x: z.coerce.number(), y: z.coerce.number() })
const searchQuery = z.object({ q: z.string().max(200).default(''), limit: z.coerce.number().int().min(1).max(20).default(8) })
const reverseQuery = z.object({ lat: z.coerce.number().min(-90).max(90), lon: z.coerce.number().min(-180).max(180) })

/**
 * Local stand-ins for a tile server and a geocoder, mounted at /api/fakes when the settings point
 * at them (the default): the client talks to them exactly as it would to the real services.
 */
export function fakesRouter(): Router {
  const router = Router()
  router.get('/tiles/:z/:x/:y.png', async (req, res) => {
    const { z: zoom, x, y } = tileParams.parse(req.params)
    if (!validTile(zoom, x, y)) {
      res.status(404).json({ error: 'No such tile.' })
      return
    }
    res.setHeader('Cache-Control', 'public, max-age=86400')
    res.type('png').send(await tile(zoom, x, y))
  })
  router.use('/geocoder', geocoderRouter())
  return router
}

/** The geocoder stand-in alone (`/search`, `/reverse`): the first-run page reaches it before anyone has signed in. */
export function geocoderRouter(): Router {
  const router = Router()
  router.get('/search', (req, res) => {
    const { q, limit } = searchQuery.parse(req.query)
    res.json(search(q, limit))
  })
  router.get('/reverse', (req, res) => {
    const { lat, lon } = reverseQuery.parse(req.query)
    res.json(reverse([lat, lon]) ?? { error: 'Unable to geocode' })
  })
  return router
}
