// The demo yard's last few weeks, made by the same services the screens call: every tow-in, police
// notice, hold, move, inspection, records request, notice, payment and release goes through its own
// service and its lifecycle guards, under a simulated clock that ends "now". Tow-ins come at any hour;
// the office, the technician and the dispatcher's desk work keep the yard's hours.
import { randomUUID } from 'node:crypto'
import type { VehicleState } from '@shared/domain/lifecycle'
import { BOARD_COLUMNS } from '@shared/domain/lifecycle'
import { instantFromWallClock, wallClock } from '@shared/domain/time'
import { vinWithCheckDigit } from '@shared/domain/vehicle'
import { paymentInputSchema } from '@shared/schemas/billing'
import { contactInputSchema, recordsAnswerSchema, recordsRequestInputSchema } from '@shared/schemas/contacts'
import { holdInputSchema } from '@shared/schemas/holds'
import { estimateLineSchema, itemFindingSchema, rollAbilitySchema, valuesSchema } from '@shared/schemas/inspections'
import { moveRequestSchema } from '@shared/schemas/moves'
import { sendNoticeSchema } from '@shared/schemas/notices'
import { policeNoticeInputSchema } from '@shared/schemas/police-notices'
import { claimantInputSchema, handoverInputSchema, signatureInputSchema } from '@shared/schemas/releases'
import { towInSchema } from '@shared/schemas/tow-in'
import { transferInputSchema } from '@shared/schemas/transfers'
import type { User } from '@shared/schemas/users'
import { invoiceOf, takePayment } from '../billing/index'
import { makeMove } from '../board/index'
import { addContact, answerRecordsRequest, recordRecordsRequest } from '../contacts/index'
import { type FileStore, loadSharp } from '../files/index'
import { setHold } from '../holds/index'
import { acknowledgeSafety, addLine, finishInspection, markRollAbility, setFinding, setValues, startInspection } from '../inspections/index'
import { generateNotices, sendNotice } from '../notices/index'
import { recordPoliceNotice } from '../police-notices/index'
import { addIdPhoto, issueGatePass, recordClaimant, recordHandover, recordOut, signRelease } from '../releases/index'
import { recordTransfer, signTransfer } from '../transfers/index'
import { changeVehicle, createTowIn, type VehicleChanges, vehicleById } from '../vehicles/index'
import { demoInspection } from './inspections'
import { DEMO_COMPANY, DEMO_DRIVERS, DEMO_YARD } from './scenario'
import type { DemoVehicle } from './vehicles'

const MINUTE = 60_000
const HOUR = 60 * MINUTE
const DAY = 24 * HOUR

/** The yard's open hours (DEMO_YARD.hours): Monday to Friday 8:00–17:00, Saturday 9:00–12:00; minutes of the day by weekday. */
const OPEN: Record<number, [number, number]> = { 1: [480, 1020], 2: [480, 1020], 3: [480, 1020], 4: [480, 1020], 5: [480, 1020], 6: [540, 720] }

export interface DemoStaff {
  manager: User
  dispatcher: User
  technician: User
  office: User
}

/** True when the instant falls within the yard's open hours (on its own clock). */
export function withinYardHours(at: Date, timeZone: string): boolean {
  const wall = wallClock(timeZone, at.getTime())
  const weekday = new Date(`${wall.slice(0, 10)}T12:00:00Z`).getUTCDay()
  const open = OPEN[weekday]
  const minute = Number(wall.slice(11, 13)) * 60 + Number(wall.slice(14, 16))
  return open !== undefined && minute >= open[0] && minute < open[1]
}

/** The first instant at or after `from` with `needMinutes` of open hours left that day. */
function officeTime(from: number, needMinutes: number, zone: string): number {
  let t = from
  for (let i = 0; i < 14; i++) {
    const wall = wallClock(zone, t)
    const day = wall.slice(0, 10)
    const weekday = new Date(`${day}T12:00:00Z`).getUTCDay()
    const open = OPEN[weekday]
    const minute = Number(wall.slice(11, 13)) * 60 + Number(wall.slice(14, 16))
    if (open) {
      if (minute < open[0]) return instantFromWallClock(zone, `${day}T${hhmm(open[0])}:00`)
      if (minute + needMinutes < open[1]) return t
    }
    const next = new Date(Date.parse(`${day}T12:00:00Z`) + DAY).toISOString().slice(0, 10)
    t = instantFromWallClock(zone, `${next}T00:00:00`)
  }
  throw new Error('The demo yard found no open hours in two weeks.')
}

const hhmm = (m: number) => `${String(Math.floor(m / 60)).padStart(2, '0')}:${String(m % 60).padStart(2, '0')}`
const dayOf = (ms: number, zone: string) => wallClock(zone, ms).slice(0, 10)

interface Step {
  at: number
  order: number
  run: () => Promise<void>
}

/** One vehicle's part of the story: the steps it takes, each at its own time, and what they share. */
interface Story {
  v: DemoVehicle
  arrivedAt: number
  vehicleId: string
  steps: Step[]
}

export interface DemoWorld {
  changes: VehicleChanges
  files: FileStore
  staff: DemoStaff
  /** Sets the simulated clock the services read through `changes.clock`. */
  setClock: (at: number) => void
  now: Date
  spaceFor: (v: DemoVehicle) => string | null
  publicUrl: string
}

/**
 * Plays the demo vehicles through the services in the order things happened. Each vehicle's steps
 * must all fall before now; when its stay is too short for the yard's hours to fit them (a weekend),
 * it came in a day earlier.
 */
export async function playDemo(world: DemoWorld, vehicles: DemoVehicle[]): Promise<void> {
  const stories: Story[] = []
  let order = 0
  for (const [i, v] of vehicles.entries()) {
    let story: Story | null = null
    for (let extraDays = 0; !story; extraDays++) {
      if (extraDays > 10) throw new Error(`The demo could not fit ${v.make} ${v.model}'s stay before now.`)
      story = planStory(world, v, i, world.now.getTime() - v.hoursAgo * HOUR - extraDays * DAY)
    }
    for (const s of story.steps) s.order = order++
    stories.push(story)
  }
  const steps = stories.flatMap((s) => s.steps).sort((a, b) => a.at - b.at || a.order - b.order)
  for (const step of steps) {
    world.setClock(step.at)
    await step.run()
  }
}

type Plan = { add: (at: number, run: () => Promise<void>) => number; last: () => number }

function planStory(world: DemoWorld, v: DemoVehicle, index: number, arrivedAt: number): Story | null {
  const zone = DEMO_YARD.timeZone
  const now = world.now.getTime()
  const { staff, changes } = world
  const story: Story = { v, arrivedAt, vehicleId: '', steps: [] }
  let cursor = arrivedAt
  const plan: Plan = {
    add: (at, run) => {
      cursor = at
      story.steps.push({ at, order: 0, run })
      return at
    },
    last: () => cursor,
  }
  /** The next desk action: at or after `target`, in open hours, after the vehicle's last step. */
  const desk = (target: number, needMinutes = 20) => officeTime(Math.max(target, cursor + 3 * MINUTE), needMinutes, zone)
  const id = () => story.vehicleId
  const path: VehicleState[] = v.state === 'closed' ? (v.disposition === 'lien_sale' ? ['arrival', 'teardown', 'decision', 'storage', 'closed'] : [...BOARD_COLUMNS, 'closed']) : BOARD_COLUMNS.slice(0, BOARD_COLUMNS.indexOf(v.state) + 1)
  // The moves are spread over the stay, a day and a half apart at most; the last leaves an hour before now.
  const span = Math.max(now - HOUR - arrivedAt, HOUR)
  const target = (step: number) => arrivedAt + Math.min((span * step) / path.length, step * 1.5 * DAY)
  // A board move as moveVehicle makes it (the same lifecycle judgement and record, under the lock), without
  // the board card it builds for the screen's answer: nobody is watching the demo being made.
  const move = (to: VehicleState, who: User, extra: { disposition?: DemoVehicle['disposition'] } = {}) => async () => {
    const body = moveRequestSchema.parse({ to, version: 1, disposition: extra.disposition ?? null, reason: null })
    await changeVehicle(changes, who, id(), (w) => makeMove(w, body, new Date(cursorOf())))
  }
  let clockNow = arrivedAt
  const cursorOf = () => clockNow
  const at = (t: number, run: () => Promise<void>) =>
    plan.add(t, async () => {
      clockNow = t
      await run()
    })

  // The tow-in, at the gate as the truck comes in (any hour).
  const calledAt = arrivedAt - 90 * MINUTE
  at(arrivedAt + 4 * MINUTE, async () => {
    const input = towInSchema.parse(towInOf(v, index, staff.dispatcher.id, calledAt, arrivedAt, world.spaceFor(v), world.now))
    const created = await createTowIn(changes, world.files, staff.dispatcher, input, [])
    story.vehicleId = created.id
  })

  // A private-property tow: the police were told 20 minutes after the call; the desk records it in
  // its hours. The newest is left untold, so the demo shows an overdue police clock.
  if (v.reason === 'private_property' && v.hoursAgo > 6) {
    at(desk(arrivedAt + 10 * MINUTE), async () => {
      const input = policeNoticeInputSchema.parse({ agency: 'Orrin Flats Police Department', person: 'Desk officer Lena Marsh', notifiedAt: new Date(calledAt + 20 * MINUTE).toISOString(), reportNumber: `OFPD-${4100 + index}` })
      await recordPoliceNotice(changes, staff.dispatcher, id(), input)
    })
  }

  for (let step = 1; step < path.length; step++) {
    const to = path[step]!
    if (to === 'teardown') at(desk(target(step)), move('teardown', staff.technician))
    if (to === 'decision') {
      at(desk(target(step), 60), async () => {})
      inspect(world, story, v, at, plan.last())
      at(plan.last() + 4 * MINUTE, move('decision', staff.technician))
      if (v.hold?.kind === 'dispute') at(desk(plan.last() + 2 * HOUR), async () => void (await setHold(changes, staff.dispatcher, id(), holdInputSchema.parse({ kind: 'dispute', note: v.hold!.note }))))
    }
    if (to === 'storage') {
      at(desk(target(step)), move('storage', staff.office))
      if (v.hold?.kind === 'lien') at(desk(plan.last() + DAY), async () => void (await setHold(changes, staff.dispatcher, id(), holdInputSchema.parse({ kind: 'lien', note: v.hold!.note }))))
      // The vehicles that stay: a records request for each (a short stop on the way to Release needs none yet).
      if (v.state === 'storage' || v.disposition === 'lien_sale') recordsAndNotices(world, story, v, at, desk, now)
    }
    if (to === 'release') {
      at(desk(target(step)), move('release', staff.office))
      if (path.includes('closed')) handOver(world, story, v, at, desk)
    }
    if (to === 'closed' && v.disposition === 'lien_sale') {
      // Disposal once the law allows it: the guards judge it on the clocks the notices started.
      lienSale(world, story, v, at, desk(Math.max(target(step), plan.last() + 16 * DAY), 30))
      at(desk(0), move('closed', staff.office, { disposition: 'lien_sale' }))
    }
  }
  return plan.last() < now - 30 * MINUTE ? story : null
}

type At = (t: number, run: () => Promise<void>) => number

/** The technician's inspection: about forty minutes in Teardown, each tap its own change. */
function inspect(world: DemoWorld, story: Story, v: DemoVehicle, at: At, from: number) {
  const { changes, staff } = world
  const tech = staff.technician
  const id = () => story.vehicleId
  const valueCents = v.valueCents ?? demoValueCents(v)
  const demo = demoInspection(v, valueCents)
  let t = from
  const next = (minutes: number, run: () => Promise<void>) => at((t += minutes * MINUTE), run)
  next(0, async () => void (await startInspection(changes, tech, id())))
  next(1, () => acknowledgeSafety(changes, tech, id()))
  for (const f of demo.findings) next(3, () => setFinding(changes, tech, id(), f.item, itemFindingSchema.parse({ status: f.status, note: f.note ?? null })))
  for (const l of demo.lines) next(2, async () => void (await addLine(changes, tech, id(), estimateLineSchema.parse({ itemCode: l.item ?? null, part: l.part, quantity: l.quantity, unitPriceCents: l.unitPriceCents, labourHours: l.labourHours }))))
  const rolls = v.rolls ?? true
  next(2, () => markRollAbility(changes, tech, id(), rollAbilitySchema.parse({ rolls, steers: rolls, brakes: rolls })))
  next(4, () => setValues(changes, tech, id(), valuesSchema.parse({ actualCashValueCents: valueCents, actualCashValueSource: demo.valueSource, salvageValueCents: Math.min(demo.salvageValueCents, valueCents), salvageValueSource: demo.salvageSource })))
  next(2, () => finishInspection(changes, tech, id()))
}

/**
 * Storage: the office asks the state for the owner records (within 15 days, or late on purpose for a
 * few), the answer comes a week later; a vehicle heading for a lien sale or disposal gets its notice
 * to the owner the records named, by certified mail.
 */
function recordsAndNotices(world: DemoWorld, story: Story, v: DemoVehicle, at: At, desk: (t: number, need?: number) => number, now: number) {
  const { changes, staff } = world
  const zone = DEMO_YARD.timeZone
  const id = () => story.vehicleId
  const sentTarget = story.arrivedAt + (v.lateRecordsRequest ? 18 : 4) * DAY
  if (v.recordsRequestNotYet || sentTarget > now - 2 * HOUR) return
  const sentAt = at(desk(sentTarget), async () => {})
  const sentOn = dayOf(sentAt, zone)
  let requestId = ''
  at(sentAt + MINUTE, async () => {
    requestId = await recordRecordsRequest(changes, staff.office, id(), recordsRequestInputSchema.parse({ agency: 'California DMV', sentOn }))
  })
  const answeredTarget = sentAt + 8 * DAY
  if (answeredTarget > now - 2 * HOUR) return
  const answeredAt = at(desk(answeredTarget), async () => {})
  const answeredOn = dayOf(answeredAt, zone)
  at(answeredAt + MINUTE, () => answerRecordsRequest(changes, staff.office, id(), requestId, recordsAnswerSchema.parse({ answeredOn, outcome: 'found' })))
  const owner = registeredOwner(v)
  at(answeredAt + 5 * MINUTE, async () => {
    await addContact(changes, staff.office, id(), contactInputSchema.parse({ role: 'registered_owner', name: owner, street: `${200 + v.odometer! % 700} Juniper St`, city: 'Orrin Flats', state: 'CA', zip: '93599', source: 'records_request', sourceDate: sentOn }))
  })
  const notice = v.disposition === 'lien_sale' ? 'disposal_notice' : v.notes?.includes('Lien sale notice') ? 'sale_notice' : null
  if (!notice) return
  const mailedAt = desk(answeredAt + 2 * DAY)
  let noticeId = ''
  at(mailedAt, async () => {
    noticeId = (await generateNotices({ changes, files: world.files, ownerLinkDays: 30 }, staff.office, id(), { kind: notice }, world.publicUrl, new Date(mailedAt)))[0]!
  })
  at(mailedAt + 10 * MINUTE, () =>
    sendNotice({ changes, files: world.files, ownerLinkDays: 30 }, staff.office, id(), noticeId, sendNoticeSchema.parse({ certifiedMail: true, trackingNumber: `9407 1000 0000 ${String(4_100_000 + v.odometer! % 900_000).padStart(7, '0')}`, mailedOn: dayOf(mailedAt, zone) })),
  )
}

/** A release at the counter: the bill paid, the claimant and their ID, the handover, the signature, the gate pass, out through the gate. */
function handOver(world: DemoWorld, story: Story, v: DemoVehicle, at: At, desk: (t: number, need?: number) => number) {
  const { changes, staff, files } = world
  const office = staff.office
  const id = () => story.vehicleId
  const t0 = desk(0, 45)
  const step = (minutes: number, run: () => Promise<void>) => at(t0 + minutes * MINUTE, run)
  let pass = ''
  step(0, async () => {
    // The counter takes what the bill says is due at that moment.
    const { vehicle, yard } = await vehicleById(changes.db, id())
    const due = (await invoiceOf(changes.db, vehicle, yard, new Date(t0))).dueCents
    await takePayment(changes, office, id(), paymentInputSchema.parse({ idempotencyKey: randomUUID(), method: 'card', amountCents: due, terminalReference: `T3-${String(48_000 + (v.odometer ?? 0) % 1000)}` }), {})
  })
  const c = v.collectedBy
  step(6, () => recordClaimant(changes, office, id(), claimantInputSchema.parse({ kind: c?.kind ?? 'registered_owner', name: c?.name ?? v.owner, actingFor: c?.actingFor ?? null, idType: 'drivers_license', idNumber: `D${String(7_100_000 + (v.odometer ?? 0) % 900_000)}`, idIssuer: 'California', idExpiry: '2029-06-30', authorityKind: c ? 'written_authorisation' : 'registration', authorityReference: c?.authority ?? `Registration card, plate ${v.plate}` }), new Date(t0 + 6 * MINUTE)))
  step(8, async () => addIdPhoto(changes, files, office, id(), [{ buffer: await idCardPhoto(), originalname: 'id.jpg' }]))
  step(12, () => recordHandover(changes, office, id(), handoverInputSchema.parse({ odometer: v.odometer === null ? null : v.odometer + 2, odometerUnreadable: v.odometer === null, property: [] }), new Date(t0 + 12 * MINUTE)))
  step(15, async () => signRelease(changes, files, office, id(), signatureInputSchema.parse({ signerName: c?.name ?? v.owner, image: await signaturePng() }), new Date(t0 + 15 * MINUTE)))
  step(17, async () => {
    pass = (await issueGatePass(changes, office, id(), new Date(t0 + 17 * MINUTE))).token
  })
  step(31, async () => void (await recordOut(changes, office, pass, new Date(t0 + 31 * MINUTE))))
}

/** The lien sale itself, on the day the law allows it: the buyer and price recorded, the bill of sale signed by the yard. */
function lienSale(world: DemoWorld, story: Story, v: DemoVehicle, at: At, t0: number) {
  const { changes, staff, files } = world
  const office = staff.office
  const id = () => story.vehicleId
  const date = dayOf(t0, DEMO_YARD.timeZone)
  at(t0, () =>
    recordTransfer(changes, office, id(), transferInputSchema.parse({ kind: 'lien_sale', sellerName: DEMO_COMPANY.name, buyerKind: 'other', buyerName: 'Delphine Okafor', buyerAddress: '58 Tamarack Rd, Orrin Flats, CA 93599', buyerIdType: 'drivers_license', buyerIdNumber: 'D8820417', priceCents: Math.round(demoValueCents(v) / 2), date, odometer: v.odometer, odometerUnreadable: v.odometer === null }), new Date(t0)),
  )
  at(t0 + 12 * MINUTE, async () => signTransfer(changes, files, office, id(), signatureInputSchema.parse({ signerName: office.name, image: await signaturePng() }), new Date(t0 + 12 * MINUTE)))
}

let idPhoto: Buffer | undefined
async function idCardPhoto(): Promise<Buffer> {
  const sharp = await loadSharp()
  idPhoto ??= await sharp({ create: { width: 640, height: 400, channels: 3, background: { r: 214, g: 226, b: 236 } } })
    .composite([{ input: Buffer.from('<svg width="640" height="400"><rect x="30" y="30" width="160" height="200" fill="#8a9bb0"/><rect x="220" y="60" width="360" height="24" fill="#4a5a6a"/><rect x="220" y="110" width="280" height="18" fill="#6a7a8a"/><rect x="220" y="150" width="300" height="18" fill="#6a7a8a"/></svg>') }])
    .jpeg()
    .toBuffer()
  return idPhoto
}

let signature: string | undefined
async function signaturePng(): Promise<string> {
  const sharp = await loadSharp()
  signature ??= `data:image/png;base64,${(await sharp(Buffer.from('<svg width="400" height="150"><rect width="400" height="150" fill="white"/><path d="M20 110 C60 20 90 140 130 70 S200 40 230 100 S320 60 380 80" stroke="#1b2a4a" stroke-width="4" fill="none"/></svg>')).png().toBuffer()).toString('base64')}`
  return signature
}

function registeredOwner(v: DemoVehicle): string {
  return v.owner && !v.owner.startsWith('Unknown') ? v.owner : 'Corwin Hale'
}

function towInOf(v: DemoVehicle, i: number, checkedById: string, calledAt: number, arrivedAt: number, spaceId: string | null, now: Date) {
  const afterHours = !withinYardHours(new Date(calledAt), DEMO_YARD.timeZone)
  return {
    tow: {
      pickup: v.pickup,
      roadMiles: null,
      winchingUnits: 0,
      dollies: v.rolls === false,
      afterHours,
      calledAt: new Date(calledAt).toISOString(),
      hookedAt: new Date(arrivedAt - 45 * MINUTE).toISOString(),
      arrivedAt: new Date(arrivedAt).toISOString(),
      reason: v.reason,
      requesterName: v.requester,
      requesterAgency: v.agency ?? null,
      requesterReference: v.reference ?? null,
      ...DEMO_DRIVERS[v.vehicleClass === 'heavy' ? 2 : i % 2]!,
    },
    vehicle: {
      vin: demoVin(v, i),
      plate: v.plate,
      plateState: v.plate ? 'CA' : null,
      year: v.year,
      make: v.make,
      model: v.model,
      colour: v.colour,
      body: v.body,
      vehicleClass: v.vehicleClass,
      odometer: v.odometer,
      odometerUnreadable: v.odometer === null,
      keys: v.keys,
      keysWhere: v.keys === 'yes' ? `Key cabinet, hook ${i + 1}` : null,
      drivableAsFound: v.reason === 'private_property' || v.reason === 'law_enforcement',
      ownerName: v.owner,
    },
    holds: v.hold?.kind === 'law_enforcement' ? [{ kind: 'law_enforcement', agency: v.hold.agency, caseNumber: v.hold.caseNumber, until: v.hold.daysLeft ? new Date(now.getTime() + v.hold.daysLeft * DAY).toISOString() : null, note: v.hold.note ?? null }] : [],
    condition: { damageNotes: v.notes ?? null, checkedById, property: [] },
    spaceId,
  }
}

// An invented market value by age, so the demo's lien clocks (which depend on value) can run.
export function demoValueCents(v: DemoVehicle): number {
  return Math.max(800, (v.year - 1998) * 550 + (v.vehicleClass === 'heavy' ? 6000 : 0)) * 100
}

export function demoVin(v: DemoVehicle, i: number): string {
  // Position 7 is numeric for model years 1980–2009 and a letter for 2010–2039 (49 CFR 565.15).
  const vds = v.vds.slice(0, 3) + (v.year >= 2010 ? 'ABCDEFGHJKLMNPRSTVWXYZ'[i % 22] : String(i % 10)) + v.vds.slice(4)
  const yearCode = 'ABCDEFGHJKLMNPRSTVWXY123456789'[(v.year - 1980) % 30]
  const serial = String(100_000 + ((i * 7919) % 900_000)).padStart(6, '0')
  return vinWithCheckDigit(`${v.wmi}${vds}${yearCode}${'KMNRT'[i % 5]}${serial}`)
}

