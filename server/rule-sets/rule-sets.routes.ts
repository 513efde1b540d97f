import { Router } from 'express'
import { z } from 'zod'
import type { Database } from '@db/client'
import { dayFromCivil } from '@shared/domain/time'
import { msg } from '@shared/schemas/field-messages'
import { notFound } from '../errors'
import { ruleSetCalendars } from '../holidays/index'
import { companyOf } from '../users/index'
import { latestRuleSetBySlug, latestRuleSets } from './rule-sets.queries'
import { ruleSetTitle } from '@shared/messages/rule-words'

const slugParam = z.object({ id: z.string().min(1).max(80) })
const yearsQuery = z.object({
  from: z.coerce.number().int().min(1990).max(2100),
  to: z.coerce.number().int().min(1990).max(2100),
}).refine((q) => q.to >= q.from && q.to - q.from <= 10, { message: msg('ruleSets.atMostTenYears', 'Ask for at most ten years, from ≤ to.'), path: ['to'] })

export function ruleSetsRouter(db: Database): Router {
  const router = Router()
  router.get('/', async (req, res) => {
    const sets = await latestRuleSets(db, await companyOf(db, req.user!.id))
    res.json({
      ruleSets: sets.map(({ slug, version, ruleSet }) => ({
        id: slug,
        version,
        ...ruleSetTitle(ruleSet),
        jurisdiction: ruleSet.jurisdiction,
        sample: ruleSet.sample,
      })),
    })
  })
  router.get('/:id', async (req, res) => {
    const { id } = slugParam.parse(req.params)
    const found = await latestRuleSetBySlug(db, await companyOf(db, req.user!.id), id)
    if (!found) throw notFound('That rule set')
    res.json({ id: found.slug, version: found.version, ruleSet: found.ruleSet })
  })
  // The client previews deadlines with the same holidays the server's business-day counts skip.
  router.get('/:id/holidays', async (req, res) => {
    const { id } = slugParam.parse(req.params)
    const { from, to } = yearsQuery.parse(req.query)
    const found = await latestRuleSetBySlug(db, await companyOf(db, req.user!.id), id)
    if (!found) throw notFound('That rule set')
    const holidays = ruleSetCalendars(found.ruleSet).closed.between(dayFromCivil(from, 1, 1), dayFromCivil(to, 12, 31))
    res.json({ holidays: holidays.map(({ date, name }) => ({ date, name })) })
  })
  return router
}
