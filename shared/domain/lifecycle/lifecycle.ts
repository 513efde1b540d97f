import { COLUMN_LABELS, DISPOSITIONS, type BoardColumn, type Disposition, type VehicleState } from './columns'
import * as g from './lifecycle-guards'
import type { Guard, MoveFacts, Reason } from './lifecycle-guards'
import { PERMISSIONS, type Permission } from '../access/permissions'
import type { Role } from '../access/roles'

export type { HoldFact, MoveFacts, Reason, ReasonCode } from './lifecycle-guards'
export type { LienSaleGate } from '../clocks/lien-sale-gate'

export interface MoveRule {
  from: BoardColumn
  to: VehicleState
  permission: Permission
  /** What the yard is doing, as the menu and the history say it. */
  label: string
  /** A step back: the person says why, and the history keeps it. */
  back?: true
  guards: readonly Guard[]
  /** Closing moves: the ways the vehicle may leave from here, each with its own guards. */
  dispositions?: Partial<Record<Disposition, readonly Guard[]>>
}

const handedOver = [g.noActiveHold, g.balanceSettled, g.claimantIdRecorded, g.releaseSigned]
// A title transfer's buyer and their ID are on its own record (server/transfers), not the release's claimant.
const titleTransfer = [g.noActiveHold, g.transferSigned]
const lienSale = [g.noActiveHold, g.lienSaleAllowed, g.lienSaleSigned]
const disposal = [g.noActiveHold, g.lienSaleAllowed]

/**
 * Every move a yard makes. Forward along the columns; back where real work goes back (a tow
 * logged into Teardown by mistake, a re-inspection, an owner calling back, a release that fell
 * through); straight to Release when an owner collects before anyone inspects; out of Storage by
 * lien sale, scrapping or title transfer once the law allows. Closed is final: the history is the record.
 */
export const MOVES: readonly MoveRule[] = [
  { from: 'arrival', to: 'teardown', permission: 'move.toTeardown', label: 'Start the teardown', guards: [] },
  { from: 'arrival', to: 'release', permission: 'release.write', label: 'Owner collects — go to Release', guards: [g.noActiveHold] },
  { from: 'teardown', to: 'decision', permission: 'inspection.write', label: 'Inspection done — owner decides', guards: [g.inspectionFinished] },
  { from: 'teardown', to: 'arrival', permission: 'move.toTeardown', label: 'Back to Arrival', back: true, guards: [] },
  { from: 'decision', to: 'storage', permission: 'owner.write', label: 'Into storage', guards: [] },
  { from: 'decision', to: 'release', permission: 'release.write', label: 'Owner collects — go to Release', guards: [g.noActiveHold] },
  { from: 'decision', to: 'teardown', permission: 'move.toTeardown', label: 'Back to Teardown for a re-inspection', back: true, guards: [] },
  { from: 'storage', to: 'release', permission: 'release.write', label: 'Go to Release', guards: [g.noActiveHold] },
  { from: 'storage', to: 'decision', permission: 'owner.write', label: 'Owner called back — Owner decision', back: true, guards: [] },
  {
    from: 'storage', to: 'closed', permission: 'release.write', label: 'Close', guards: [],
    dispositions: { lien_sale: lienSale, scrapped: disposal, title_transferred: titleTransfer },
  },
  { from: 'release', to: 'storage', permission: 'release.write', label: 'Release fell through — back to Storage', back: true, guards: [] },
  {
    from: 'release', to: 'closed', permission: 'release.write', label: 'Close', guards: [],
    dispositions: { returned_to_owner: handedOver, released_to_third_party: handedOver, title_transferred: titleTransfer, lien_sale: lienSale, scrapped: disposal },
  },
]

export function ruleFor(from: VehicleState, to: VehicleState): MoveRule | undefined {
  return MOVES.find((m) => m.from === from && m.to === to)
}

/** Whether judging this move (and way out) reads the vehicle's bill, so the server works it out only then. */
export function readsBill(from: VehicleState, to: VehicleState, disposition?: Disposition | null): boolean {
  const rule = ruleFor(from, to)
  if (!rule) return false
  const guards = [...rule.guards, ...((disposition && rule.dispositions?.[disposition]) || [])]
  return guards.some((guard) => g.BILL_GUARDS.has(guard))
}

export interface MoveAttempt {
  from: VehicleState
  to: VehicleState
  role: Role
  facts: MoveFacts
  disposition?: Disposition | null
  reason?: string | null
  now?: Date
}

export interface Verdict {
  allowed: boolean
  /** The role may not make this move at all (the server answers 403, not 422). */
  forbidden: boolean
  reasons: Reason[]
}

const ROLE_WORDS: Record<Role, string> = { manager: 'managers', dispatcher: 'dispatchers', technician: 'technicians', office: 'office staff' }

function roleReason(rule: MoveRule): Reason {
  const names = (PERMISSIONS[rule.permission] as readonly Role[]).map((r) => ROLE_WORDS[r])
  const who = names.length > 1 ? `${names.slice(0, -1).join(', ')} and ${names.at(-1)}` : names[0]
  const what = rule.to === 'closed' ? 'close a vehicle' : `move a vehicle from ${COLUMN_LABELS[rule.from]} to ${COLUMN_LABELS[rule.to]}`
  return { code: 'role', message: `Only ${who} can ${what}.` }
}

function noSuchMove(from: VehicleState, to: VehicleState): Reason {
  if (from === to) return { code: 'not-a-move', message: `It is already in ${COLUMN_LABELS[from]}.` }
  if (from === 'closed') return { code: 'not-a-move', message: 'It is closed; a closed vehicle does not come back to the board.' }
  return { code: 'not-a-move', message: `A vehicle does not go from ${COLUMN_LABELS[from]} to ${COLUMN_LABELS[to]}.` }
}

/** Whether this person may make this move now, and every reason why not, in the yard's words. */
export function checkMove(a: MoveAttempt): Verdict {
  const rule = ruleFor(a.from, a.to)
  if (!rule) return { allowed: false, forbidden: false, reasons: [noSuchMove(a.from, a.to)] }
  if (!(PERMISSIONS[rule.permission] as readonly Role[]).includes(a.role)) return { allowed: false, forbidden: true, reasons: [roleReason(rule)] }
  const ctx = { to: a.to, now: a.now ?? new Date() }
  const reasons = rule.guards.flatMap((guard) => guard(a.facts, ctx))
  if (rule.dispositions) reasons.push(...dispositionReasons(rule, a))
  if (rule.back && !a.reason?.trim()) reasons.push({ code: 'reason', message: `Say why it goes back to ${COLUMN_LABELS[a.to]}.` })
  return { allowed: reasons.length === 0, forbidden: false, reasons }
}

function dispositionReasons(rule: MoveRule, a: MoveAttempt): Reason[] {
  if (!a.disposition) return [{ code: 'disposition', message: 'Choose how the vehicle leaves the yard.' }]
  const guards = rule.dispositions![a.disposition]
  if (!guards) {
    const ways = DISPOSITIONS.filter((d) => rule.dispositions![d]).map((d) => DISPOSITION_WORDS[d])
    const list = `${ways.slice(0, -1).join(', ')} or ${ways.at(-1)}`
    return [{ code: 'disposition', message: `From ${COLUMN_LABELS[rule.from]} a vehicle leaves only by ${list}; to hand it over, move it to Release first.` }]
  }
  return guards.flatMap((guard) => guard(a.facts, { to: 'closed', now: a.now ?? new Date() }))
}

const DISPOSITION_WORDS: Record<Disposition, string> = {
  returned_to_owner: 'return to its owner',
  released_to_third_party: 'release to a third party',
  title_transferred: 'title transfer',
  lien_sale: 'lien sale',
  scrapped: 'scrapping',
}

export interface MoveOption {
  rule: MoveRule
  disposition: Disposition | null
  /** Allowed once the reason a step back needs is given. */
  allowed: boolean
  reasons: Reason[]
}

/** What the "Move to…" menu offers from where the vehicle is: each target, or each way out, with why not. */
export function moveOptions(from: VehicleState, role: Role, facts: MoveFacts, now = new Date()): MoveOption[] {
  return MOVES.filter((m) => m.from === from).flatMap((rule) => {
    const ways: (Disposition | null)[] = rule.dispositions ? DISPOSITIONS.filter((d) => rule.dispositions![d]) : [null]
    return ways.map((disposition) => {
      const reasons = checkMove({ from, to: rule.to, role, facts, disposition, now }).reasons.filter((r) => r.code !== 'reason')
      return { rule, disposition, allowed: reasons.length === 0, reasons }
    })
  })
}
