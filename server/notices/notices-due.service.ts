import { and, eq, inArray, ne } from 'drizzle-orm'
import type { Database } from '@db/client'
import { notices, vehicles } from '@db/schema'
import { isDueNow, plannedNotices } from '@shared/domain/notices'
import type { BulkResult, DueNotice } from '@shared/schemas/notices'
import type { User } from '@shared/schemas/users'
import { clocksOfVehicles } from '../clock-events/index'
import { contactsOf } from '../contacts/index'
import { AppError, notFound } from '../errors'
import { vehicleForUser } from '../vehicles/index'
import { yardOfUser } from '../yards/index'
import { yardToday } from './notice-inputs'
import { sendNotice } from './notice-sending.service'
import { generateNotices, type NoticeDeps } from './notices.service'

/**
 * Every notice due now across the signed-in person's yard: its clock has started, its window is open,
 * nothing has been mailed and no letter of that kind has been made yet. One query for the vehicles,
 * one for their notices, the clocks worked out in a batch.
 */
export async function dueNotices(db: Database, userId: string, now = new Date()): Promise<DueNotice[]> {
  const yard = await yardOfUser(db, userId)
  if (!yard) throw notFound('Your yard')
  const rows = await db.select().from(vehicles).where(and(eq(vehicles.yardId, yard.id), ne(vehicles.state, 'closed')))
  if (rows.length === 0) return []
  const made = await db.select({ vehicleId: notices.vehicleId, kind: notices.kind }).from(notices).where(inArray(notices.vehicleId, rows.map((r) => r.id)))
  const madeKeys = new Set(made.map((m) => `${m.vehicleId}:${m.kind}`))
  const clocks = await clocksOfVehicles(db, rows, yard, now)
  const today = yardToday(yard, now)
  const due: DueNotice[] = []
  for (const v of rows) {
    const worked = clocks.get(v.id)
    if (!worked) continue
    for (const n of plannedNotices(worked.clocks, today)) {
      if (isDueNow(n) && !madeKeys.has(`${v.id}:${n.kind}`)) due.push({ vehicleId: v.id, stockNumber: v.stockNumber, kind: n.kind, dueDate: n.dueDate, status: n.status })
    }
  }
  return due.sort((a, b) => (a.dueDate ?? '9999').localeCompare(b.dueDate ?? '9999') || a.stockNumber.localeCompare(b.stockNumber))
}

/**
 * "All notices due today", one vehicle at a time (the screen shows the progress): makes each due letter
 * for every recipient and e-mails those with an address. Every letter gets its own result; one that
 * cannot go out says why, and is never dropped: it stays on the vehicle to mail or to send again.
 */
export async function sendDueNotices(deps: NoticeDeps, actor: User, vehicleId: string, base: string, now = new Date()): Promise<BulkResult[]> {
  const { db } = deps.changes
  const { vehicle } = await vehicleForUser(db, actor.id, vehicleId)
  const due = (await dueNotices(db, actor.id, now)).filter((d) => d.vehicleId === vehicleId)
  const results: BulkResult[] = []
  const base0 = { vehicleId, stockNumber: vehicle.stockNumber }
  for (const d of due) {
    let ids: string[]
    try {
      ids = await generateNotices(deps, actor, vehicleId, { kind: d.kind }, base, now)
    } catch (err) {
      if (!(err instanceof AppError)) throw err
      results.push({ ...base0, kind: d.kind, contactName: null, outcome: 'failed', noticeId: null, reason: err.message })
      continue
    }
    const contacts = await contactsOf(db, vehicleId)
    const made = await db.select({ id: notices.id, contactId: notices.contactId }).from(notices).where(inArray(notices.id, ids))
    for (const n of made) {
      const contact = contacts.find((c) => c.id === n.contactId)
      const one = { ...base0, kind: d.kind, contactName: contact?.name ?? null, noticeId: n.id }
      if (!contact?.email) {
        results.push({ ...one, outcome: 'failed', reason: 'No e-mail address on record: print the letter and send it by certified mail, or add an address and send it again.' })
        continue
      }
      try {
        await sendNotice(deps, actor, vehicleId, n.id, { certifiedMail: false, email: true, trackingNumber: null, mailedOn: null })
        results.push({ ...one, outcome: 'queued', reason: null })
      } catch (err) {
        if (!(err instanceof AppError)) throw err
        results.push({ ...one, outcome: 'failed', reason: err.message })
      }
    }
  }
  return results
}
