import type { Role } from './roles'

// The access table of DESIGN.md, one permission per row. The server maps every route to one of these
// (server/access.ts) and the client uses the same table to show only what a role may use.
export const PERMISSIONS = {
  'board.view': ['manager', 'dispatcher', 'technician', 'office'],
  'towin.write': ['manager', 'dispatcher'],
  'move.toTeardown': ['manager', 'dispatcher', 'technician'],
  'inspection.write': ['manager', 'technician'],
  // The vehicle's value and salvage value: the technician or the office may have the figure.
  'inspection.values': ['manager', 'technician', 'office'],
  'owner.write': ['manager', 'office'],
  'billing.write': ['manager', 'office'],
  'release.write': ['manager', 'office'],
  // Whoever logs the tow-in prints the stock label; the office prints it again at the counter.
  'label.print': ['manager', 'dispatcher', 'office'],
  'charges.waive': ['manager'],
  // Issue 10: the office sends the notices, so it sees what went out and sends a failed message again.
  'outbox': ['manager', 'office'],
  // Issue 10: every open deadline across the yard, on a page and as a calendar feed.
  'deadlines': ['manager', 'office'],
  // Issue 12: receivables, aged inventory, the daily report and the salvage inventory.
  'reports': ['manager', 'office'],
  'admin': ['manager'],
} as const satisfies Record<string, readonly Role[]>

export type Permission = keyof typeof PERMISSIONS

export function can(role: Role | null | undefined, permission: Permission): boolean {
  return role != null && (PERMISSIONS[permission] as readonly Role[]).includes(role)
}
