import { Router } from 'express'
import type { Database } from '@db/client'
import { legalClocks } from '@shared/domain/clocks'
import { storageBill } from '@shared/domain/billing'
import { legalClocksRequestSchema, storageQuoteRequestSchema } from '@shared/schemas/quotes'
import { AppError, fieldIssue, said } from '../errors'
import { ruleSetCalendars } from '../holidays/index'
import { latestRuleSetBySlug } from '../rule-sets/index'
import { companyOf } from '../users/index'

/** What a stay would cost and when its notices fall due, under a rule set — nothing is written. */
export function quotesRouter(db: Database): Router {
  const router = Router()

  async function ruleSetFor(userId: string, slug: string) {
    const found = await latestRuleSetBySlug(db, await companyOf(db, userId), slug)
    if (!found) throw new AppError(400, `There is no rule set "${slug}".`, said('noRuleSetNamed', { name: slug }, { issues: [fieldIssue('ruleSetId', 'quotes.noSuchRuleSet', 'No such rule set.')] }))
    return found.ruleSet
  }

  router.post('/storage', async (req, res) => {
    const input = storageQuoteRequestSchema.parse(req.body)
    const ruleSet = await ruleSetFor(req.user!.id, input.ruleSetId)
    res.json({ bill: storageBill(input.stay, ruleSet, input.asOf, { timeZone: input.timeZone }) })
  })

  router.post('/clocks', async (req, res) => {
    const input = legalClocksRequestSchema.parse(req.body)
    const ruleSet = await ruleSetFor(req.user!.id, input.ruleSetId)
    const clocks = legalClocks(input.vehicle, input.events, ruleSet, ruleSetCalendars(ruleSet), input.asOf, { timeZone: input.timeZone })
    res.json({ clocks })
  })
  return router
}
