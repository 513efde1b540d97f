import { eq } from 'drizzle-orm'
import sharp from 'sharp'
import type { Database } from '@db/client'
import * as t from '@db/schema'
import { makeVehicle } from './factories'
import { sampleVersion } from './board'
import type { BrowserSession } from './app'

/**
 * A rule set version that charges nothing (every daily rate 0, no fees), made from the shipped
 * ordinance template. Until counter payments land (issue 11, another helper's part), this is how a
 * release test reaches a settled balance honestly: nothing is owed, so nothing is unpaid.
 */
export async function freeRuleSetVersion(db: Database): Promise<string> {
  const templateId = await sampleVersion(db, 'ordinance-24h-template')
  const [template] = await db.select().from(t.ruleSetVersions).where(eq(t.ruleSetVersions.id, templateId))
  const body = structuredClone(template!.body) as { vehicleClasses: { dailyRateCents: number }[]; fees: unknown[]; id: string; name: string }
  for (const c of body.vehicleClasses) c.dailyRateCents = 0
  body.fees = []
  const slug = `free-${crypto.randomUUID().slice(0, 8)}`
  body.id = slug
  body.name = 'Test: charges nothing'
  const [set] = await db.insert(t.ruleSets).values({ slug, name: body.name }).returning()
  const [version] = await db.insert(t.ruleSetVersions).values({ ruleSetId: set!.id, version: 1, body }).returning()
  return version!.id
}

/** A vehicle in Release that owes nothing, with two items of personal property from its intake. */
export async function vehicleInRelease(db: Database, yardId: string, overrides: Partial<typeof t.vehicles.$inferInsert> = {}) {
  const v = await makeVehicle(db, yardId, { state: 'release', ruleSetVersionId: await freeRuleSetVersion(db), odometer: 88_000, colour: 'Moss green', plate: '7QRT412', plateState: 'CA', ...overrides })
  const items = await db
    .insert(t.propertyItems)
    .values([
      { vehicleId: v.id, item: 'Child car seat', location: 'Rear seat' },
      { vehicleId: v.id, item: 'Toolbox', location: 'Trunk' },
    ])
    .returning()
  return { vehicle: v, items }
}

export const CLAIMANT = {
  kind: 'registered_owner',
  name: 'Dana Okafor',
  actingFor: null,
  idType: 'drivers_license',
  idNumber: 'D4471902',
  idIssuer: 'California',
  idExpiry: '2030-05-31',
  authorityKind: 'registration',
  authorityReference: 'Registration card, plate 7QRT412',
}

/** A signature as the pad sends it: a PNG data URL with a few pen strokes on a transparent background. */
export async function signaturePng(strokes = true): Promise<string> {
  const svg = `<svg xmlns="http://www.w3.org/2000/svg" width="600" height="200">${
    strokes ? '<path d="M20 150 C 80 20, 140 20, 180 140 S 300 180, 340 60 L 420 150 Q 500 40 580 120" stroke="#1E2B33" stroke-width="5" fill="none"/>' : ''
  }</svg>`
  const png = await sharp(Buffer.from(svg)).png().toBuffer()
  return `data:image/png;base64,${png.toString('base64')}`
}

export const idPhoto = () => sharp({ create: { width: 120, height: 76, channels: 3, background: '#c9822b' } }).jpeg().toBuffer()

/** Every step of the counter's release, in order, for a vehicle from vehicleInRelease. */
export async function completeRelease(s: BrowserSession, vehicleId: string, itemIds: string[]) {
  const base = `/api/vehicles/${vehicleId}/release`
  const steps = [
    await s.put(`${base}/claimant`, CLAIMANT),
    await s.agent.post(`${base}/id-photo`).set('x-csrf-token', s.csrf).attach('files', await idPhoto(), 'licence.jpg'),
    await s.put(`${base}/handover`, { odometer: 88_140, odometerUnreadable: false, property: itemIds.map((itemId, i) => ({ itemId, returned: i === 0, note: i === 0 ? null : 'Owner left it for now' })) }),
    await s.post(`${base}/signature`, { signerName: 'Dana Okafor', image: await signaturePng() }),
  ]
  for (const r of steps) if (r.status >= 300) throw new Error(`release step failed: ${r.status} ${JSON.stringify(r.body)}`)
  return steps.at(-1)!.body
}
