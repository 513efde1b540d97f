import { Router } from 'express'
import type { Database } from '@db/client'
import type { MapSettings } from '@shared/schemas/map'
import { notFound } from '../errors'
import { yardOfUser } from '../yards/index'
import type { MapConfig } from './map-config'

/** GET /api/map/settings — the client reads its tile and geocoder URLs here, never from its bundle. */
export function mapRouter(db: Database, map: MapConfig): Router {
  const router = Router()
  router.get('/settings', async (req, res) => {
    const yard = await yardOfUser(db, req.user!.id)
    if (!yard) throw notFound('A yard for your company')
    const settings: MapSettings = { ...map, yard: { name: yard.name, lat: yard.lat, lng: yard.lng } }
    res.json(settings)
  })
  return router
}
