import { readFileSync } from 'node:fs'
import path from 'node:path'
import { eq } from 'drizzle-orm'
import request from 'supertest'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import * as t from '@db/schema'
import { ruleWords } from '@shared/messages/rule-words'
import { ruleSetSchema } from '@shared/schemas/rule-sets'
import { ownerPageSchema } from '@shared/schemas/owner'
import { addSampleWords, SAMPLE_RULE_SETS_DIR } from '../../server/rule-sets/index'
import { makeTestApp, signedIn, type TestApp } from '../helpers/app'
import { makeStaff, makeVehicle } from '../helpers/factories'
import { DAY, sampleVersion } from '../helpers/board'
import { pdfText } from '../helpers/pdf'

// The sample rule sets' own words in the reader's language (issue 14): the answers carry the Spanish beside
// the English, the client picks with ruleWords; letters go out in the recipient's language. The Spanish
// expected here is the samples' own (server/rule-sets/samples/*.json), not a reference value.
let app: TestApp
beforeAll(async () => {
  app = await makeTestApp({ publicUrl: 'https://yard.example.test' })
})
afterAll(() => app.close())

const spanishFields = JSON.parse(readFileSync(path.join(import.meta.dirname, '../../shared/messages/es/fields.json'), 'utf8')) as { fields: { ruleSets: Record<string, string> } }
const sample = (file: string) => JSON.parse(readFileSync(path.join(SAMPLE_RULE_SETS_DIR, file), 'utf8')) as Record<string, unknown>

async function fileBytes(session: Awaited<ReturnType<typeof signedIn>>, fileId: string) {
  const res = await session.agent.get(`/api/files/${fileId}`).buffer(true).parse((r, done) => {
    const chunks: Buffer[] = []
    r.on('data', (c: Buffer) => chunks.push(c))
    r.on('end', () => done(null, Buffer.concat(chunks)))
  })
  expect(res.status).toBe(200)
  return new Uint8Array(res.body as Buffer)
}

describe("the owner's page in Spanish", () => {
  it('carries the Spanish step label, citation and caution that a Spanish reader is shown', async () => {
    const staff = await makeStaff(app.db)
    const vehicle = await makeVehicle(app.db, staff.yard.id, { state: 'storage', ruleSetVersionId: await sampleVersion(app.db, 'california-sample'), arrivedAt: new Date(Date.now() - 3 * DAY) })
    const office = await signedIn(app.app, staff.office)
    const link = (await office.post(`/api/vehicles/${vehicle.id}/owner-links`)).body as { token: string }
    const page = ownerPageSchema.parse((await request(app.app).get(`/api/owner/${link.token}`).expect(200)).body)

    // With no value on record, only the records request runs (it does not depend on the value).
    const step = page.deadlines.find((d) => d.code === 'records-request')!
    expect(step.label).toBe('Request owner and lienholder records')
    const inSpanish = ruleWords(step, 'es')
    expect(inSpanish.label).toBe('Pedir los datos del dueño y del acreedor prendario')
    expect(inSpanish.citation).toMatch(/^Cal\. Civ\. Code § 3072 \(vehículos con valor de \$4,000 o menos\): pedir los datos/)
    expect(inSpanish.citation).toContain('Cal. Veh. Code § 22851.8')
    expect(ruleWords(step, 'en')).toEqual(step)
    expect(ruleWords({ caution: page.caution!, es: page.es }, 'es').caution).toMatch(/^Ejemplo — verifique con su código local\./)
  })
})

describe('the staff screens carry the Spanish beside the English', () => {
  it("the vehicle's next deadline, its Deadlines entry and its bill's fee lines", async () => {
    const staff = await makeStaff(app.db)
    const vehicle = await makeVehicle(app.db, staff.yard.id, { state: 'storage', ruleSetVersionId: await sampleVersion(app.db, 'florida-sample'), arrivedAt: new Date(Date.now() - 2 * DAY) })
    const office = await signedIn(app.app, staff.office)

    const page = (await office.get(`/api/vehicles/${vehicle.id}`).expect(200)).body
    const next = page.summary.nextDeadline
    expect(next).toMatchObject({ code: 'notice-of-lien', label: 'Send the notice of lien by certified mail', es: { label: 'Enviar el aviso de gravamen por correo certificado' } })
    expect(next.es.citation).toMatch(/^Fla\. Stat\. § 713\.78\(4\): aviso de gravamen por correo certificado dentro de 7 días hábiles/)
    // The counting rules it followed carry their citations' Spanish too (the sample's businessDays and mailDeadlines).
    const counting = next.rules.find((r: { code: string }) => r.code === 'business-days')
    expect(ruleWords(counting, 'es').citation).toMatch(/^Fla\. Stat\. § 713\.78\(4\): el aviso de gravamen va por correo certificado/)

    const list = (await office.get('/api/deadlines').expect(200)).body
    const entry = list.entries.find((e: { vehicleId: string }) => e.vehicleId === vehicle.id)
    expect(entry).toMatchObject({ code: 'notice-of-lien', es: { label: 'Enviar el aviso de gravamen por correo certificado' } })

    const invoice = (await office.get(`/api/vehicles/${vehicle.id}/invoice`).expect(200)).body.invoice
    const impound = invoice.lines.find((l: { code: string }) => l.code === 'impound')
    expect(impound).toMatchObject({ kind: 'fee', label: 'Impound and storage intake', es: { label: 'Depósito e ingreso al almacenaje' } })
  })
})

describe("a rule set's Spanish name", () => {
  it('the samples carry it wherever the rule set is named: the settings list, the vehicle page and the bill', async () => {
    const staff = await makeStaff(app.db)
    const vehicle = await makeVehicle(app.db, staff.yard.id, { state: 'storage', ruleSetVersionId: await sampleVersion(app.db, 'florida-sample'), arrivedAt: new Date(Date.now() - 2 * DAY) })
    const manager = await signedIn(app.app, staff.manager)
    const listed = (await manager.get('/api/settings/rule-sets').expect(200)).body.ruleSets as { id: string; name: string; es?: { name?: string } }[]
    expect(listed.find((r) => r.id === 'florida-sample')).toMatchObject({ name: 'Florida (sample)', es: { name: 'Florida (ejemplo)' } })
    const page = (await manager.get(`/api/vehicles/${vehicle.id}`).expect(200)).body
    expect(ruleWords(page.ruleSet, 'es')).toMatchObject({ name: 'Florida (ejemplo)', caution: expect.stringMatching(/^Ejemplo — verifique/) })
    expect(ruleWords(page.ruleSet, 'en').name).toBe('Florida (sample)')
    const invoice = (await manager.get(`/api/vehicles/${vehicle.id}/invoice`).expect(200)).body.invoice
    expect(invoice.ruleSet.es.name).toBe('Florida (ejemplo)')
  })

  it('a manager saves it; an empty box means none; a copy does not keep the name it was copied from', async () => {
    const staff = await makeStaff(app.db)
    const m = await signedIn(app.app, staff.manager)
    const copy = (await m.post('/api/settings/rule-sets/florida-sample/copy', { name: 'Our Orlando rates' }).expect(201)).body
    expect(copy.ruleSet.es).toEqual({ caution: expect.stringMatching(/^Ejemplo/) })

    const named = { ...copy.ruleSet, es: { ...copy.ruleSet.es, name: '  Nuestras tarifas de Orlando ' } }
    const saved = (await m.put(`/api/settings/rule-sets/${copy.id}`, { version: 1, ruleSet: named }).expect(200)).body
    expect(saved.ruleSet.es.name).toBe('Nuestras tarifas de Orlando')
    const listed = (await m.get('/api/settings/rule-sets').expect(200)).body.ruleSets as { id: string; es?: { name?: string } }[]
    expect(listed.find((r) => r.id === copy.id)?.es?.name).toBe('Nuestras tarifas de Orlando')

    const emptied = { ...saved.ruleSet, es: { ...saved.ruleSet.es, name: '   ' } }
    const again = (await m.put(`/api/settings/rule-sets/${copy.id}`, { version: 2, ruleSet: emptied }).expect(200)).body
    expect(again.ruleSet.es.name).toBeUndefined()
    expect(ruleWords(again.ruleSet, 'es').name).toBe('Our Orlando rates')
  })

  it('too long, it is refused with the field named, in both languages, and nothing is written', async () => {
    const staff = await makeStaff(app.db)
    const m = await signedIn(app.app, staff.manager)
    const copy = (await m.post('/api/settings/rule-sets/florida-sample/copy', { name: 'Our Tampa rates' }).expect(201)).body
    const versions = await app.db.$count(t.ruleSetVersions)
    const audit = await app.db.$count(t.settingsChanges)
    const res = await m.put(`/api/settings/rule-sets/${copy.id}`, { version: 1, ruleSet: { ...copy.ruleSet, es: { ...copy.ruleSet.es, name: 'n'.repeat(121) } } })
    expect(res.status).toBe(400)
    expect(res.body.issues).toContainEqual(expect.objectContaining({ path: 'ruleSet.es.name', code: 'ruleSets.spanishNameLength', message: 'Keep the Spanish name to 120 characters or fewer.' }))
    expect(spanishFields.fields.ruleSets.spanishNameLength).toBe('El nombre en español no puede pasar de 120 caracteres.')
    expect(await app.db.$count(t.ruleSetVersions)).toBe(versions)
    expect(await app.db.$count(t.settingsChanges)).toBe(audit)
    // 120 characters are fine.
    await m.put(`/api/settings/rule-sets/${copy.id}`, { version: 1, ruleSet: { ...copy.ruleSet, es: { ...copy.ruleSet.es, name: 'n'.repeat(120) } } }).expect(200)
  })
})

describe('a notice letter in Spanish', () => {
  it('names the step in Spanish and keeps the statute as it is cited; the English letter stays English', async () => {
    const staff = await makeStaff(app.db)
    const vehicle = await makeVehicle(app.db, staff.yard.id, { state: 'storage', ruleSetVersionId: await sampleVersion(app.db, 'florida-sample'), arrivedAt: new Date(Date.now() - 2 * DAY), vin: '1G4AH59H45G118341' })
    const office = await signedIn(app.app, staff.office)
    const owner = { role: 'registered_owner', name: 'Marisol Quintero', street: '418 Alder Row', city: 'Orrin Flats', state: 'FL', zip: '32801', language: 'es', source: 'vehicle_papers' }
    const bank = { role: 'lienholder', name: 'Harbor Tide Credit Union', street: '90 Quay St', city: 'Port Ellery', state: 'FL', zip: '32034', language: 'en', source: 'vehicle_papers' }
    for (const c of [owner, bank]) expect((await office.post(`/api/vehicles/${vehicle.id}/contacts`, c)).status).toBe(201)
    const made = await office.post(`/api/vehicles/${vehicle.id}/notices`, { kind: 'owner_notice' })
    expect(made.status, JSON.stringify(made.body)).toBe(201)
    const letterIn = async (language: string) => {
      const notice = made.body.notices.find((n: { language: string }) => n.language === language)
      return (await pdfText(await fileBytes(office, notice.fileId))).replace(/\s+/g, ' ')
    }

    const spanish = await letterIn('es')
    expect(spanish).toContain('Enviar el aviso de gravamen por correo certificado — Fla. Stat. § 713.78(4): aviso de gravamen por correo certificado dentro de 7 días hábiles')
    expect(spanish).toContain('La Fla. Stat. § 713.78 se modificó en 2024')
    expect(spanish).toContain('Florida (ejemplo)')
    expect(spanish).not.toContain('Florida (sample)')
    expect(spanish).not.toContain('Send the notice of lien')
    const english = await letterIn('en')
    expect(english).toContain('Send the notice of lien by certified mail — Fla. Stat. § 713.78(4): notice of lien by certified mail within 7 business days')
    expect(english).not.toContain('Enviar el aviso')
    expect(english).toContain('Florida (sample)')
  })
})

describe('rule sets stored before the Spanish', () => {
  it("gain the samples' Spanish where their English is still the sample's, and nothing else changes", async () => {
    const florida = sample('florida.json')
    const old = ruleSetSchema.parse(florida)
    const stripped = JSON.parse(JSON.stringify(florida, (key, value: unknown) => (key === 'es' ? undefined : value))) as Record<string, unknown>
    const timeline = stripped.timeline as { label: string; source: { citation: string } }[]
    timeline[0]!.label = 'Our own wording of the notice'
    const fees = stripped.fees as { label: string; es?: { label: string } }[]
    fees[1]!.es = { label: 'Nuestro aviso' }
    const [set] = await app.db.insert(t.ruleSets).values({ slug: `old-florida-${Date.now()}`, name: 'Old Florida copy' }).returning()
    const [version] = await app.db.insert(t.ruleSetVersions).values({ ruleSetId: set!.id, version: 1, body: stripped }).returning()

    expect(await addSampleWords(app.db)).toBeGreaterThanOrEqual(1)
    const [row] = await app.db.select().from(t.ruleSetVersions).where(eq(t.ruleSetVersions.id, version!.id))
    const filled = ruleSetSchema.parse(row!.body)
    // The label the yard rewrote has no Spanish; its citation, still the sample's, has.
    expect(filled.timeline[0]!.es?.label).toBeUndefined()
    expect(filled.timeline[0]!.source.es?.citation).toBe(old.timeline[0]!.source.es?.citation)
    expect(filled.timeline[1]!.es?.label).toBe('Primer día para la venta por gravamen')
    // Spanish the yard wrote itself stays; the others are the sample's.
    expect(filled.fees.map((f) => f.es?.label)).toEqual(['Depósito e ingreso al almacenaje', 'Nuestro aviso', 'Entrega fuera de horario'])
    expect(filled.vehicleClasses.map((c) => c.es?.label)).toEqual(old.vehicleClasses.map((c) => c.es?.label))
    expect(filled.es?.caution).toBe(old.es?.caution)
    // The rule set's name, still the sample's, and the total-loss citation get theirs too.
    expect(filled.es?.name).toBe('Florida (ejemplo)')
    expect(filled.totalLoss.source.es?.citation).toBe(old.totalLoss.source.es?.citation)
    // Only words were added: with every `es` taken away again, the version is what it was.
    const bare = JSON.parse(JSON.stringify(row!.body, (key, value: unknown) => (key === 'es' ? undefined : value))) as Record<string, unknown>
    const strippedAgain = JSON.parse(JSON.stringify(stripped, (key, value: unknown) => (key === 'es' ? undefined : value))) as Record<string, unknown>
    expect(bare).toEqual(strippedAgain)

    // Run again (another server starting): nothing more to add to it.
    await addSampleWords(app.db)
    const [again] = await app.db.select().from(t.ruleSetVersions).where(eq(t.ruleSetVersions.id, version!.id))
    expect(again!.body).toEqual(row!.body)
  })
})
