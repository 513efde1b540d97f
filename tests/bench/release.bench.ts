import { pathToFileURL } from 'node:url'
import sharp from 'sharp'
import { releaseForm, type ReleaseFormData } from '../../server/documents/index'
import { writeBenchResult } from './results'

// Issue 11: the release form with its signature, p95 at most 100 ms per document.
const goals = { p95Ms: 100 }

async function sample(): Promise<ReleaseFormData> {
  const svg = '<svg xmlns="http://www.w3.org/2000/svg" width="600" height="200"><path d="M20 150 C 80 20, 140 20, 180 140 S 300 180, 340 60 L 420 150" stroke="#1E2B33" stroke-width="5" fill="none"/></svg>'
  const jpeg = await sharp(Buffer.from(svg)).flatten({ background: '#ffffff' }).jpeg({ quality: 84 }).toBuffer()
  const now = new Date()
  return {
    yard: { name: 'Tamsin Creek Towing', address: '48 Quarry Spur Road, Orrin Flats', phone: '555-0142', timeZone: 'America/Los_Angeles' },
    vehicle: { stockNumber: 'TC-2026-00015', vin: '2KMVM04E56T210866', year: 2006, make: 'Tessaro', model: 'Nomad 650', colour: 'Black', plate: '19K7730', plateState: 'CA', arrivedAt: new Date(now.getTime() - 9 * 86_400_000) },
    claimant: { kind: 'registered_owner', name: 'Dana Okafor', actingFor: null, idType: 'drivers_license', idNumber: 'D4471902', idIssuer: 'California', idExpiry: '2030-05-31', authorityKind: 'registration', authorityReference: 'Registration card' },
    disposition: 'returned_to_owner',
    odometer: 31_420,
    odometerUnreadable: false,
    charges: { towCents: 19_500, storageCents: 48_000, days: 9, paidCents: 67_500, waived: false },
    property: [
      { item: 'Child car seat', count: 1, returned: true, note: null },
      { item: 'Toolbox', count: 1, returned: false, note: 'Owner left it for now' },
    ],
    signature: { jpeg, signerName: 'Dana Okafor', signedAt: now },
    printedAt: now,
  }
}

export async function run(options: { documents?: number } = {}) {
  const count = options.documents ?? 100
  const data = await sample()
  for (let i = 0; i < 10; i++) await releaseForm(data, 'en') // warm: fonts and pdf-lib load with the first
  // Wall-clock time is the goal; this process's CPU time says what a document costs when other
  // processes share the cores (as they do on a loaded machine).
  const ms: number[] = []
  const cpuMs: number[] = []
  for (let i = 0; i < count; i++) {
    const started = performance.now()
    const cpu = process.cpuUsage()
    await releaseForm(data, i % 2 ? 'es' : 'en')
    const used = process.cpuUsage(cpu)
    ms.push(performance.now() - started)
    cpuMs.push((used.user + used.system) / 1000)
  }
  const p = (values: number[], q: number) => {
    const sorted = [...values].sort((a, b) => a - b)
    return Math.round(sorted[Math.min(sorted.length - 1, Math.floor(q * sorted.length))]! * 10) / 10
  }
  const p95Ms = p(ms, 0.95)
  const result = {
    name: 'release',
    goals,
    documents: count,
    p50Ms: p(ms, 0.5),
    p95Ms,
    p95CpuMs: p(cpuMs, 0.95),
    ratioToGoal: Math.round((p95Ms / goals.p95Ms) * 100) / 100,
    met: p95Ms <= goals.p95Ms,
  }
  writeBenchResult('release', result)
  return result
}

if (import.meta.url === pathToFileURL(process.argv[1]!).href) console.log(await run())
