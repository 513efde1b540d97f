import { Router } from 'express'
import type { Database } from '@db/client'
import { firstRunWith, type FirstRunChoices, type FirstRunState } from '@shared/schemas/first-run'
import { geocoderRouter, TOWN_CENTRE } from '../fakes/index'
import { LOCAL_MAP, type MapConfig } from '../map/index'
import { sampleChoices } from '../rule-sets/index'
import { refusingCommonPasswords } from '../users/index'
import { firstRunNeeded, setUpFirstCompany, stillNeeded } from './first-run.service'

// No yard exists yet to centre the map on: the stand-in's own town, or the whole of the lower 48 states.
const LOWER_48 = { lat: 39.83, lng: -98.58, zoom: 4 }

/**
 * /api/first-run: public, and of use only while no company exists (afterwards the POST, the choices and
 * the geocoder are 409 and the GET says `needed: false`). The client signs the new manager in with the
 * password just chosen. The yard starts from one of the shipped samples, judged by the shared schema.
 */
export function firstRunRouter(db: Database, map: MapConfig, ruleSetsFolder?: string): Router {
  const router = Router()
  const samples = sampleChoices(ruleSetsFolder)
  const firstRunInput = refusingCommonPasswords(firstRunWith(samples.map((s) => s.id)))
  const localGeocoder = map.geocoderUrl === LOCAL_MAP.geocoderUrl

  router.get('/', async (_req, res) => {
    const body: FirstRunState = { needed: await firstRunNeeded(db) }
    res.json(body)
  })
  router.get('/choices', async (_req, res) => {
    await stillNeeded(db)
    const { tileUrl, tileAttribution, maxZoom } = map
    const body: FirstRunChoices = {
      ruleSets: samples,
      map: {
        tileUrl,
        tileAttribution,
        maxZoom,
        geocoderUrl: localGeocoder ? '/api/first-run/geocoder' : map.geocoderUrl,
        start: localGeocoder ? { ...TOWN_CENTRE, zoom: 14 } : LOWER_48,
      },
    }
    res.json(body)
  })
  // The built-in geocoder is for signed-in staff; before anyone can sign in, the first run reaches it here.
  if (localGeocoder) {
    router.use('/geocoder', async (_req, _res, next) => {
      await stillNeeded(db)
      next()
    })
    router.use('/geocoder', geocoderRouter())
  }
  router.post('/', async (req, res) => {
    const input = firstRunInput.parse(req.body)
    res.status(201).json(await setUpFirstCompany(db, input, ruleSetsFolder))
  })
  return router
}
