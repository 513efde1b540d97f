import { eq } from 'drizzle-orm'
import type { z } from 'zod'
import { policeNotices, tows } from '@db/schema'
import { needsPoliceNotice, policeNoticeClock, type PoliceNotification } from '@shared/domain/clocks'
import type { PoliceNoticeReply, policeNoticeInputSchema } from '@shared/schemas/police-notices'
import type { User } from '@shared/schemas/users'
import { ruleSetsOf } from '../charges/index'
import { badRequest, conflict, fieldIssue, unprocessable, said } from '../errors'
import { changeVehicle, type VehicleChanges } from '../vehicles/index'

type Input = z.output<typeof policeNoticeInputSchema>

/**
 * Records who at the police was told of a tow, when, and the report number: it meets the rule set's
 * police-notification clock. One transaction with its history event; recorded once per vehicle.
 */
export async function recordPoliceNotice(changes: VehicleChanges, actor: User, vehicleId: string, input: Input): Promise<PoliceNoticeReply> {
  const notification: PoliceNotification = { notifiedAt: new Date(input.notifiedAt).toISOString(), agency: input.agency, person: input.person, reportNumber: input.reportNumber }
  const { version, result } = await changeVehicle(changes, actor, vehicleId, async ({ tx, vehicle, yard, now, record }) => {
    if (vehicle.state === 'closed') throw conflict('This vehicle has left the yard; its police notification can no longer be recorded.', said('closedPolice'))
    const [tow] = await tx.select().from(tows).where(eq(tows.vehicleId, vehicleId))
    const rule = (await ruleSetsOf(tx, yard, [vehicle])).get(vehicle.id)?.policeNotice
    if (!tow || !needsPoliceNotice(rule, tow.reason)) throw unprocessable("The vehicle's rule set asks no police notification for this tow.", said('policeNotAsked'))
    const [already] = await tx.select({ at: policeNotices.notifiedAt }).from(policeNotices).where(eq(policeNotices.vehicleId, vehicleId))
    if (already) throw conflict(`The police notification is already recorded (${already.at.toISOString()}).`, said('policeAlready'))
    const towTimes = [tow.calledAt, tow.hookedAt, tow.arrivedAt].filter((t): t is Date => t !== null)
    const earliest = new Date(Math.min(...towTimes.map((t) => t.getTime())))
    if (Date.parse(notification.notifiedAt) < earliest.getTime()) {
      const at = earliest.toISOString()
      const message = `When the police were told cannot be before the tow (${at}).`
      throw badRequest(message, [fieldIssue('notifiedAt', 'policeNotices.notBeforeTow', message, { at, timeZone: yard.timeZone })])
    }
    await tx.insert(policeNotices).values({ vehicleId, ...notification, notifiedAt: new Date(notification.notifiedAt), recordedById: actor.id, recordedAt: now })
    record({ kind: 'police_notified', after: { ...notification } })
    const times = { reason: tow.reason, calledAt: tow.calledAt?.toISOString() ?? null, hookedAt: tow.hookedAt?.toISOString() ?? null, arrivedAt: tow.arrivedAt.toISOString() }
    return policeNoticeClock(rule, times, notification, now.toISOString())!
  })
  return { version, clock: result }
}
