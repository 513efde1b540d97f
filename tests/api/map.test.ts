import request from 'supertest'
import sharp from 'sharp'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { cspSources } from '../../server/map/index'
import { makeTestApp, signedIn, type BrowserSession, type TestApp } from '../helpers/app'
import { makeStaff } from '../helpers/factories'

let app: TestApp
let s: BrowserSession
beforeAll(async () => {
  app = await makeTestApp()
  s = await signedIn(app.app, (await makeStaff(app.db)).technician)
})
afterAll(() => app.close())

describe('map settings and the local stand-ins', () => {
  it('by default the client is pointed at the built-in tiles and geocoder, and at its yard', async () => {
    const res = await s.get('/api/map/settings').expect(200)
    expect(res.body).toMatchObject({ tileUrl: '/api/fakes/tiles/{z}/{x}/{y}.png', geocoderUrl: '/api/fakes/geocoder', maxZoom: 19, yard: { lat: 36.4, lng: -119.35 } })
  })

  it('serves a 256-pixel PNG tile for the demo town', async () => {
    // Zoom 16 tile holding the demo yard (36.4127, -119.3521).
    const res = await s.agent.get('/api/fakes/tiles/16/11040/25637.png').buffer(true).expect(200)
    expect(res.headers['content-type']).toBe('image/png')
    const meta = await sharp(res.body as Buffer).metadata()
    expect([meta.format, meta.width, meta.height]).toEqual(['png', 256, 256])
  })

  it('refuses a tile outside the world', async () => {
    expect((await s.get('/api/fakes/tiles/3/8/0.png')).status).toBe(404)
  })

  it('the geocoder finds demo addresses as you type, in the shape of a Nominatim answer', async () => {
    const res = await s.agent.get('/api/fakes/geocoder/search').query({ q: 'sunridge' }).expect(200)
    expect(res.body).toEqual([expect.objectContaining({ display_name: 'Sunridge Plaza, 300 Harrow Way, Orrin Flats', lat: '36.418800', lon: '-119.361200' })])
    const numbered = await s.agent.get('/api/fakes/geocoder/search').query({ q: '600 Marlow Boulevard' }).expect(200)
    expect(numbered.body[0].display_name).toBe('600 Marlow Blvd, Orrin Flats')
  })

  it('reverse geocoding names the nearest place, or says it cannot', async () => {
    const yard = await s.agent.get('/api/fakes/geocoder/reverse').query({ lat: 36.4128, lon: -119.352 }).expect(200)
    expect(yard.body.display_name).toBe('1480 Quarry Spur Rd (Quarry Spur yard), Orrin Flats')
    // Issue 16 item 4: a pin by a street far from any known place is named on that street, not on the
    // yard's own street (the nearest known place), so the address follows the pin.
    const byHarrow = await s.agent.get('/api/fakes/geocoder/reverse').query({ lat: 36.4182, lon: -119.3632 }).expect(200)
    expect(byHarrow.body.display_name).toMatch(/^\d+ Harrow Way, Orrin Flats$/)
    const nowhere = await s.agent.get('/api/fakes/geocoder/reverse').query({ lat: 40, lon: -100 }).expect(200)
    expect(nowhere.body).toEqual({ error: 'Unable to geocode' })
  })

  it('the stand-ins answer only signed-in staff', async () => {
    expect((await request(app.app).get('/api/fakes/geocoder/search?q=kettle')).status).toBe(401)
  })
})

describe('configured services', () => {
  it.each([
    ['https://{s}.tiles.example.org/{z}/{x}/{y}.png', ['https://*.tiles.example.org']],
    ['https://geo.example.com/nominatim', ['https://geo.example.com']],
    ['/api/fakes/geocoder', []],
  ])('%s needs the CSP sources %j', (url, sources) => {
    expect(cspSources(url)).toEqual(sources)
  })

  it('an outside tile server and geocoder are allowed by the CSP, and the stand-ins are not mounted', async () => {
    const map = { tileUrl: 'https://tiles.example.org/{z}/{x}/{y}.png', tileAttribution: '© Example', maxZoom: 18, geocoderUrl: 'https://geo.example.com' }
    const other = await makeTestApp({ map })
    try {
      const res = await request(other.app).get('/api/health')
      expect(res.headers['content-security-policy']).toMatch(/img-src 'self' data: blob: https:\/\/tiles\.example\.org;/)
      expect(res.headers['content-security-policy']).toMatch(/connect-src 'self' https:\/\/geo\.example\.com(;|$)/)
      const staff = await makeStaff(other.db)
      const m = await signedIn(other.app, staff.manager)
      expect((await m.get('/api/map/settings')).body).toMatchObject(map)
      expect((await m.get('/api/fakes/geocoder/search?q=kettle')).status).toBe(404)
    } finally {
      await other.close()
    }
  })
})
