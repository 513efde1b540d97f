import { readdirSync } from 'node:fs'
import path from 'node:path'
import { eq } from 'drizzle-orm'
import sharp from 'sharp'
import type { Database } from '@db/client'
import * as t from '@db/schema'
import { loadSampleRuleSets } from '../../server/rule-sets/index'
import type { TowInInput } from '@shared/schemas/tow-in'
import { freshVin } from './vins'

/** A valid 17-character VIN (check digit 4, model year 2005): 49 CFR 565's own sample. */
export const GOOD_VIN = '1G4AH59H45G118341'

/** A complete tow-in a dispatcher might send; `edit` changes it before it is used. */
/**
 * Another vehicle than the default one (a fresh VIN of the same maker and year, a fresh plate), for a
 * test that logs two in one company: the same VIN twice asks the dispatcher why (issue 16, item 14).
 */
export function anotherVehicle(b: TowInInput) {
  b.vehicle.vin = freshVin()
  b.vehicle.plate = `8T${b.vehicle.vin.slice(-6)}`
}

export function towInBody(checkedById: string, edit: (b: TowInInput) => void = () => {}): TowInInput {
  const body: TowInInput = {
    tow: {
      pickup: { lat: 36.4231, lng: -119.3377, address: 'Marlow Blvd & Kettle Ave, Orrin Flats' },
      roadMiles: null,
      winchingUnits: 0,
      dollies: false,
      afterHours: false,
      calledAt: new Date(Date.now() - 90 * 60_000).toISOString(),
      hookedAt: new Date(Date.now() - 45 * 60_000).toISOString(),
      arrivedAt: new Date(Date.now() - 5 * 60_000).toISOString(),
      reason: 'breakdown',
      requesterName: 'Owner by phone',
      truck: 'Truck 5 — wheel-lift',
      driver: 'Tomas Reyna',
    },
    vehicle: {
      vin: GOOD_VIN,
      plate: '7KQM214',
      plateState: 'CA',
      year: 2005,
      make: 'Orlan',
      model: 'Sparrow',
      colour: 'Silver',
      body: 'Sedan',
      vehicleClass: 'standard',
      odometer: 168_402,
      keys: 'yes',
      keysWhere: 'In the ignition',
      drivableAsFound: false,
      ownerName: 'Marisol Vantongeren',
    },
    holds: [],
    condition: { damageNotes: 'Scrape on the left rear door.', checkedById, property: [{ item: 'Child seat', location: 'Back seat', count: 1 }] },
    spaceId: null,
  }
  edit(body)
  return body
}

/** The shipped sample rule sets, once per database; returns the California sample's rule-set id. */
let loaded: Promise<string> | undefined
let loadedFor: Database | undefined
export async function sampleRuleSet(db: Database): Promise<string> {
  if (loadedFor !== db) {
    loadedFor = db
    // Read back by slug: another helper may have loaded the samples into this database first.
    loaded = loadSampleRuleSets(db).then(async () => {
      const [set] = await db.select().from(t.ruleSets).where(eq(t.ruleSets.slug, 'california-sample'))
      return set!.id
    })
  }
  return loaded!
}

export const DEMO_RATES = { hookUpCents: 19_500, perMileCents: 650, includedMiles: 5, winchingCentsPerUnit: 9_500, dolliesCents: 7_500, afterHoursCents: 8_500 }

/** A small photo with EXIF that must not survive (an owner's name) and an orientation that must. */
export function photo(width = 64, height = 40, colour = '#3e6a8a') {
  return sharp({ create: { width, height, channels: 3, background: colour } })
    .withExif({ IFD0: { Artist: 'secret-camera-owner' } })
    .withMetadata({ orientation: 6 })
    .jpeg()
    .toBuffer()
}

export const pngImage = () => sharp({ create: { width: 20, height: 20, channels: 4, background: '#e9a23b80' } }).png().toBuffer()

/** Rows in every table a tow-in writes, and the stock numbers handed out: a refusal changes none. */
export async function counts(db: Database) {
  const [vehicles, tows, files, history, holds, property, counters] = [
    await db.$count(t.vehicles),
    await db.$count(t.tows),
    await db.$count(t.files),
    await db.$count(t.historyEvents),
    await db.$count(t.holds),
    await db.$count(t.propertyItems),
    (await db.select().from(t.stockCounters)).reduce((sum, c) => sum + c.last, 0),
  ]
  return { vehicles, tows, files, history, holds, property, counters }
}

/** Every file under the store's folder, half-written ones included. */
export function filesOnDisk(dir: string): string[] {
  return readdirSync(dir, { recursive: true, withFileTypes: true })
    .filter((e) => e.isFile())
    .map((e) => path.join(e.parentPath, e.name))
}
