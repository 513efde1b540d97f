import { and, desc, eq } from 'drizzle-orm'
import type { Executor } from '@db/client'
import { clockEvents } from '@db/schema'
import type { LegalClocks } from '@shared/domain/clocks'
import { dayFromIsoDate, isoDate, localDay, startOfLocalDay } from '@shared/domain/time'
import { clockStepInputSchema, OFFICE_STEP_EVENTS, type ClockStepInput, type ClockStepsPage, type OfficeStepEvent } from '@shared/schemas/clock-steps'
import type { User } from '@shared/schemas/users'
import { addClockEvent, vehicleClocks } from '../clock-events/index'
import { badRequest, conflict, fieldIssue, said } from '../errors'
import { changeVehicle, vehicleForUser, type VehicleChanges } from '../vehicles/index'

/** The day on record for an event (the yard's calendar), the latest if ever more than one. */
async function recordedDay(db: Executor, vehicleId: string, event: OfficeStepEvent, zone: string): Promise<string | null> {
  const [row] = await db
    .select({ at: clockEvents.at })
    .from(clockEvents)
    .where(and(eq(clockEvents.vehicleId, vehicleId), eq(clockEvents.kind, event)))
    .orderBy(desc(clockEvents.at))
    .limit(1)
  return row ? isoDate(localDay(zone, row.at.getTime())) : null
}

/** The steps of the vehicle's clocks (the branch that applies) each office event starts or meets. */
function stepsOf(clocks: LegalClocks, event: OfficeStepEvent): ClockStepsPage['steps'][number]['deadlines'] {
  return clocks.deadlines
    .filter((d) => d.start.event === event || d.doneBy.event === event)
    .map((d) => ({
      code: d.code,
      label: d.label,
      role: d.doneBy.event === event ? ('meets' as const) : ('starts' as const),
      status: d.status,
      dueDate: d.dueDate ?? null,
      citation: d.source.citation,
      ...(d.es || d.source.es ? { es: { ...(d.es?.label ? { label: d.es.label } : {}), ...(d.source.es?.citation ? { citation: d.source.es.citation } : {}) } } : {}),
    }))
}

/** Which of the office's steps the vehicle's clocks use, each with its steps and the day on record. */
export async function clockStepsPage(db: Executor, user: User, vehicleId: string, now = new Date()): Promise<ClockStepsPage> {
  const { vehicle, yard } = await vehicleForUser(db, user.id, vehicleId)
  const worked = await vehicleClocks(db, vehicle, yard, now)
  const steps: ClockStepsPage['steps'] = []
  if (worked) {
    for (const event of OFFICE_STEP_EVENTS) {
      const deadlines = stepsOf(worked.clocks, event)
      if (deadlines.length > 0) steps.push({ event, recordedDay: await recordedDay(db, vehicleId, event, yard.timeZone), deadlines })
    }
  }
  return { vehicleId, steps }
}

/**
 * Records a step only the office can witness (the lien sale application filed, the state's notice
 * mailed, the notice of sale posted) as its clock event, from the start of that day in the yard's
 * zone (as a publication's first day). Refused naming the field: a day after today on the yard's
 * calendar, a day before the vehicle arrived, a step the vehicle's clocks do not use; a closed vehicle
 * is refused whole. Recorded again, the new day replaces the one on record (a clerk correcting a
 * typed day), and the history event says which day it replaced.
 */
export async function recordClockStep(changes: VehicleChanges, actor: User, vehicleId: string, raw: ClockStepInput, now = new Date()) {
  const input = clockStepInputSchema.parse(raw)
  const day = dayFromIsoDate(input.day, 'day')
  return changeVehicle(changes, actor, vehicleId, async (w) => {
    if (w.vehicle.state === 'closed') throw conflict(`${w.vehicle.stockNumber} has left the yard: its lien-sale steps can no longer change.`, said('closedClockStep', { stock: w.vehicle.stockNumber }))
    const zone = w.yard.timeZone
    if (day > localDay(zone, now.getTime())) {
      const message = 'The day cannot be in the future: record a step once it has happened.'
      throw badRequest(message, [fieldIssue('day', 'clockSteps.dayInFuture', message)])
    }
    const arrived = localDay(zone, w.vehicle.arrivedAt.getTime())
    if (day < arrived) {
      const date = isoDate(arrived)
      const message = `The day cannot be before the vehicle arrived (${date}).`
      throw badRequest(message, [fieldIssue('day', 'clockSteps.dayBeforeArrival', message, { date })])
    }
    const worked = await vehicleClocks(w.tx, w.vehicle, w.yard, now)
    if (!worked || stepsOf(worked.clocks, input.event).length === 0) {
      const message = "This vehicle's rule set does not use this step."
      throw badRequest(message, [fieldIssue('event', 'clockSteps.stepNotUsed', message)])
    }
    const before = await recordedDay(w.tx, vehicleId, input.event, zone)
    await w.tx.delete(clockEvents).where(and(eq(clockEvents.vehicleId, vehicleId), eq(clockEvents.kind, input.event)))
    await addClockEvent(w.tx, { vehicleId, kind: input.event, at: new Date(startOfLocalDay(zone, day)), source: 'office-step', sourceId: null, recordedById: actor.id })
    w.record({
      kind: 'clock_step_recorded',
      before: before ? { event: input.event, day: before } : null,
      after: { event: input.event, day: input.day, note: input.note ?? null, replaced: before !== null },
    })
  })
}
