import type { RequestHandler } from 'express'
import { match } from 'path-to-regexp'
import { can, type Permission } from '@shared/domain/access'
import { badRequest, fieldIssue, forbidden, unauthorized } from './errors'

type Rule = 'public' | 'staff' | Permission

/**
 * The one access table: every API route and who may call it. A route missing here answers 403
 * (401 when signed out) — deny by default. Finer checks (e.g. which board move a role may make)
 * happen in the services with the same permissions.
 */
export const ACCESS: Record<string, Rule> = {
  'GET /api/health': 'public',
  'GET /api/health/live': 'public',
  'GET /api/health/ready': 'public',
  'GET /api/session': 'public',
  'POST /api/session': 'public',
  'DELETE /api/session': 'public',
  // Anyone signed in sets their own language, and only their own.
  'PUT /api/session/locale': 'staff',
  // A fresh install's first manager (no company yet): the routes refuse (409) once any company exists.
  'GET /api/first-run': 'public',
  'POST /api/first-run': 'public',
  'GET /api/first-run/choices': 'public',
  'GET /api/first-run/geocoder/search': 'public',
  'GET /api/first-run/geocoder/reverse': 'public',

  'GET /api/users': 'admin',
  'POST /api/users': 'admin',
  'PATCH /api/users/:id': 'admin',
  'PUT /api/users/:id/yards': 'admin',
  'POST /api/users/:id/password': 'admin',

  'GET /api/yards/current': 'board.view',
  'GET /api/yards/mine': 'board.view',
  'PUT /api/yards/current': 'board.view',
  'GET /api/board': 'board.view',
  'GET /api/board/events': 'board.view',
  // Which moves a role may make is the lifecycle's to say (shared/domain/lifecycle/lifecycle.ts), per move.
  'POST /api/vehicles/:vehicleId/moves': 'board.view',
  'GET /api/vehicles/closed': 'board.view',

  'GET /api/rule-sets': 'board.view',
  'GET /api/rule-sets/:id': 'board.view',
  'GET /api/rule-sets/:id/holidays': 'board.view',
  'POST /api/quotes/storage': 'board.view',
  'POST /api/quotes/clocks': 'board.view',
  // Settings (issue 12): managers edit rule sets, choose the yard's, and read the settings audit.
  'GET /api/settings/rule-sets': 'admin',
  'GET /api/settings/rule-sets/:id': 'admin',
  'POST /api/settings/rule-sets/:id/copy': 'admin',
  'PUT /api/settings/rule-sets/:id': 'admin',
  'GET /api/settings/rule-sets/:id/older-vehicles': 'admin',
  'PUT /api/settings/yard-rule-set': 'admin',
  'GET /api/settings/audit': 'admin',
  // The rule-set editor's calendar choices and its preview's holidays for a draft's calendars.
  'GET /api/settings/holiday-calendars': 'admin',
  'GET /api/settings/holidays': 'admin',
  // Settings → Yards (issue 12): the manager's yards, their rates and spaces.
  'GET /api/settings/yards': 'admin',
  'POST /api/settings/yards': 'admin',
  'PATCH /api/settings/yards/:yardId': 'admin',
  'POST /api/settings/yards/:yardId/spaces': 'admin',
  'POST /api/settings/yards/:yardId/spaces/:spaceId/retire': 'admin',
  'POST /api/vehicles/:vehicleId/rule-set-version': 'admin',

  // Named paths before '/:id', which would match them too.
  'GET /api/vehicles/intake-options': 'towin.write',
  'GET /api/vehicles/search': 'board.view',
  'POST /api/vehicles': 'towin.write',
  'GET /api/vehicles/:vehicleId': 'board.view',
  'PATCH /api/vehicles/:vehicleId': 'towin.write',
  // The value picks the lien clocks' branch: the office, which sends the notices, records it.
  'PUT /api/vehicles/:vehicleId/value': 'owner.write',
  'GET /api/vehicles/:vehicleId/history': 'board.view',
  'GET /api/vehicles/:vehicleId/history/verify': 'board.view',
  'GET /api/vehicles/:vehicleId/inspection': 'board.view',
  'POST /api/vehicles/:vehicleId/inspection': 'inspection.write',
  'POST /api/vehicles/:vehicleId/inspection/safety': 'inspection.write',
  'PUT /api/vehicles/:vehicleId/inspection/items/:code': 'inspection.write',
  'POST /api/vehicles/:vehicleId/inspection/items/:code/photos': 'inspection.write',
  'POST /api/vehicles/:vehicleId/inspection/lines': 'inspection.write',
  'PUT /api/vehicles/:vehicleId/inspection/lines/:lineId': 'inspection.write',
  'DELETE /api/vehicles/:vehicleId/inspection/lines/:lineId': 'inspection.write',
  'PUT /api/vehicles/:vehicleId/inspection/values': 'inspection.values',
  'PATCH /api/vehicles/:vehicleId/inspection/roll-ability': 'inspection.write',
  'POST /api/vehicles/:vehicleId/inspection/finish': 'inspection.write',
  'GET /api/vehicles/:vehicleId/owner-links': 'board.view',
  'POST /api/vehicles/:vehicleId/owner-links': 'owner.write',
  'POST /api/vehicles/:vehicleId/owner-links/:linkId/revoke': 'owner.write',
  // Who to tell (issue 10): everyone on the board reads it; the office and managers keep it.
  'GET /api/vehicles/:vehicleId/contacts': 'board.view',
  'POST /api/vehicles/:vehicleId/contacts': 'owner.write',
  'PUT /api/vehicles/:vehicleId/contacts/:contactId': 'owner.write',
  'DELETE /api/vehicles/:vehicleId/contacts/:contactId': 'owner.write',
  'POST /api/vehicles/:vehicleId/records-requests': 'owner.write',
  'PUT /api/vehicles/:vehicleId/records-requests/:requestId/answer': 'owner.write',
  // Notice letters: everyone on the board sees what went out; the office makes, sends and records them.
  'GET /api/vehicles/:vehicleId/notices': 'board.view',
  'POST /api/vehicles/:vehicleId/notices': 'owner.write',
  'POST /api/vehicles/:vehicleId/notices/due': 'owner.write',
  'POST /api/vehicles/:vehicleId/notices/:noticeId/send': 'owner.write',
  'POST /api/vehicles/:vehicleId/notices/:noticeId/sendings/:sendingId/returned': 'owner.write',
  'GET /api/notices/due': 'owner.write',
  'POST /api/vehicles/:vehicleId/holds': 'towin.write',
  // The dispatcher who logged the private-property tow tells the police and records it.
  'POST /api/vehicles/:vehicleId/police-notice': 'towin.write',
  'POST /api/vehicles/:vehicleId/holds/:holdId/lift': 'towin.write',
  'PUT /api/vehicles/:vehicleId/space': 'towin.write',
  'POST /api/vehicles/:vehicleId/files': 'towin.write',
  'GET /api/vehicles/:vehicleId/documents/key-tag': 'label.print',
  // Issue 11, the money at the counter: the office and managers bill and take payments; giving money
  // back and waiving or discounting a charge are a manager's (a second one above the company's limit).
  'GET /api/vehicles/:vehicleId/invoice': 'billing.write',
  'POST /api/vehicles/:vehicleId/payments': 'billing.write',
  'GET /api/vehicles/:vehicleId/payments/:paymentId/receipt': 'billing.write',
  'POST /api/vehicles/:vehicleId/refunds': 'charges.waive',
  'POST /api/vehicles/:vehicleId/adjustments': 'charges.waive',
  'POST /api/vehicles/:vehicleId/adjustments/:adjustmentId/approve': 'charges.waive',
  'POST /api/vehicles/:vehicleId/adjustments/:adjustmentId/decline': 'charges.waive',
  // Card payments on the payment service's hosted page (issue 11): opened by the counter, recorded by its webhook.
  'POST /api/vehicles/:vehicleId/card-checkouts': 'billing.write',
  'GET /api/vehicles/:vehicleId/card-checkouts/:checkoutId': 'billing.write',
  'POST /api/vehicles/:vehicleId/card-checkouts/:checkoutId/expire': 'billing.write',
  // A refund of a hosted-page card payment through the service: managers, as every refund.
  'POST /api/vehicles/:vehicleId/card-refunds': 'charges.waive',
  // Public with the service's signature as its guard (checked on the raw body, server/card-payments/).
  'POST /api/card-payments/webhook': 'public',
  'GET /api/cash-drawer': 'billing.write',
  'POST /api/cash-drawer/closeout': 'billing.write',
  'GET /api/vehicles/:vehicleId/documents/pickup-ticket': 'release.write',
  // The counter's release (issue 11): who collects, their ID, the handover, the signature, the papers.
  'GET /api/vehicles/:vehicleId/release': 'release.write',
  'PUT /api/vehicles/:vehicleId/release/claimant': 'release.write',
  'POST /api/vehicles/:vehicleId/release/id-photo': 'release.write',
  'POST /api/vehicles/:vehicleId/release/photos': 'release.write',
  'PUT /api/vehicles/:vehicleId/release/handover': 'release.write',
  'POST /api/vehicles/:vehicleId/release/signature': 'release.write',
  'GET /api/vehicles/:vehicleId/release/form': 'release.write',
  'POST /api/vehicles/:vehicleId/release/gate-pass': 'release.write',
  // Title transfer (issue 11): a sign-over or a lien sale, its bill of sale, signature and packet.
  'GET /api/vehicles/:vehicleId/transfer': 'release.write',
  'PUT /api/vehicles/:vehicleId/transfer': 'release.write',
  'POST /api/vehicles/:vehicleId/transfer/signature': 'release.write',
  'GET /api/vehicles/:vehicleId/transfer/packet': 'release.write',
  // The lien sale's newspaper publication (issue 10): the office's notices.
  'GET /api/vehicles/:vehicleId/publications': 'owner.write',
  'POST /api/vehicles/:vehicleId/publications': 'owner.write',
  'GET /api/vehicles/:vehicleId/publications/text': 'owner.write',
  'POST /api/vehicles/:vehicleId/publications/:publicationId/proof': 'owner.write',
  // The lien sale's day (issue 10): never earlier than the law allows.
  'GET /api/vehicles/:vehicleId/sale-date': 'owner.write',
  'PUT /api/vehicles/:vehicleId/sale-date': 'owner.write',
  // The lien-sale steps only the office can witness: the application, the state's notice, the posting.
  'GET /api/vehicles/:vehicleId/clock-events': 'owner.write',
  'POST /api/vehicles/:vehicleId/clock-events': 'owner.write',
  // The gate's phone: a pass (in the body, never the path) reaches one vehicle's record-out, once.
  'POST /api/gate/check': 'release.write',
  'POST /api/gate/record-out': 'release.write',
  'GET /api/files/:id': 'board.view',
  'GET /api/files/:id/thumb': 'board.view',
  'GET /api/spaces': 'board.view',
  'GET /api/map/settings': 'board.view',
  // Whoever logs or corrects a tow-in fills the vehicle from its VIN.
  'GET /api/vin-decode/:vin': 'towin.write',
  'GET /api/outbox': 'outbox',
  'GET /api/outbox/:messageId': 'outbox',
  'GET /api/outbox/:messageId/attachments/:attachmentId': 'outbox',
  'POST /api/outbox/:messageId/retry': 'outbox',
  // Issue 12: each person's Today page (what it lists follows the role); the office's reports; the manager's yard at a glance.
  'GET /api/today': 'board.view',
  'GET /api/reports/receivables': 'reports',
  'GET /api/reports/receivables.csv': 'reports',
  'GET /api/reports/aged': 'reports',
  'GET /api/reports/daily': 'reports',
  'GET /api/reports/daily.pdf': 'reports',
  'GET /api/reports/salvage': 'reports',
  'GET /api/reports/salvage.csv': 'reports',
  'GET /api/reports/salvage.pdf': 'reports',
  'GET /api/glance': 'admin',
  'GET /api/deadlines': 'deadlines',
  'GET /api/deadlines.ics': 'deadlines',
  // Each person's own calendar feed: only ever their own (the routes read the session's user).
  'GET /api/deadlines/feed': 'deadlines',
  'POST /api/deadlines/feed': 'deadlines',
  'DELETE /api/deadlines/feed': 'deadlines',
  // Public with its secret token checked by the route: one person's Deadlines calendar, nothing else.
  'GET /api/calendar/:token/deadlines.ics': 'public',
  // Public with their key checked by every route (server/owner/owner.routes.ts): the key reaches one
  // vehicle's owner page, its photos, its cost on a date and its owner's choice — nothing else.
  'GET /api/owner/:key': 'public',
  'GET /api/owner/:key/quote': 'public',
  'POST /api/owner/:key/decision': 'public',
  'POST /api/owner/:key/card-checkout': 'public',
  'POST /api/owner/:key/release-signature': 'public',
  'GET /api/owner/:key/files/:fileId': 'public',
  'GET /api/owner/:key/files/:fileId/thumb': 'public',
  // Public, rate-limited per address: whether a yard here holds a plate + VIN tail, where, what is owed.
  'POST /api/vehicle-lookup': 'public',
  // The demo town's plain tiles: the owner's page shows the yard on them.
  'GET /api/fakes/tiles/:z/:x/:y.png': 'public',
  'GET /api/fakes/geocoder/search': 'staff',
  'GET /api/fakes/geocoder/reverse': 'staff',
}

const compiled = Object.entries(ACCESS).map(([key, rule]) => {
  const [method, path] = key.split(' ') as [string, string]
  return { method, test: match(path), rule }
})

export function ruleFor(method: string, path: string): Rule | undefined {
  const m = method === 'HEAD' ? 'GET' : method
  return compiled.find((c) => c.method === m && c.test(path))?.rule
}

export const enforceAccess: RequestHandler = (req, _res, next) => {
  let rule: Rule | undefined
  try {
    rule = ruleFor(req.method, req.baseUrl + req.path)
  } catch (err) {
    // path-to-regexp decodes each parameter: a broken %-escape cannot name anything.
    if (err instanceof URIError) return next(badRequest('That address has a broken %-escape.', [fieldIssue('url', 'common.brokenEscape', 'That address has a broken %-escape.')]))
    throw err
  }
  if (rule === 'public') return next()
  if (!req.user) return next(unauthorized())
  if (rule === undefined) return next(forbidden('This action is not available.', 'notAvailable'))
  if (rule === 'staff' || can(req.user.role, rule)) return next()
  next(forbidden())
}
