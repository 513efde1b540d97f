import type { RuleSet, Source } from '../../schemas/rule-sets'
import { assertCents, type Cents, formatCents } from '../billing/money'
import { DomainError } from '../errors'

export type RepairOrSalvage = {
  recommendation: 'repair' | 'salvage'
  rule: 'percent-of-value' | 'total-loss-formula'
  numbers: { estimateCents: Cents; actualCashValueCents: Cents; salvageValueCents: Cents; thresholdCents: Cents }
  /** The share of the value that makes a total loss (percent-of-value only), for the screens' own words. */
  percent?: number
  /** For the owner, in plain words: what was compared and what it means. */
  explanation: string[]
  source: Source
}

/**
 * Repair or salvage by the rule set's total-loss rule: either a share of the vehicle's value
 * (the estimate reaching it makes a total loss), or the Total Loss Formula (repair cost +
 * salvage value ≥ actual cash value). Compared in whole cents, so no float decides a case.
 */
export function repairOrSalvage(
  estimateCents: Cents,
  actualCashValueCents: Cents,
  salvageValueCents: Cents,
  ruleSet: Pick<RuleSet, 'totalLoss'>,
): RepairOrSalvage {
  assertCents(estimateCents, 'estimateCents')
  assertCents(actualCashValueCents, 'actualCashValueCents')
  assertCents(salvageValueCents, 'salvageValueCents')
  if (actualCashValueCents === 0) {
    throw new DomainError('invalid-amount', "Enter the vehicle's value before comparing it with the estimate.", 'actualCashValueCents')
  }
  const rule = ruleSet.totalLoss
  const estimate = formatCents(estimateCents)
  const value = formatCents(actualCashValueCents)
  const salvage = formatCents(salvageValueCents)
  const numbers = { estimateCents, actualCashValueCents, salvageValueCents }

  if (rule.rule === 'percent-of-value') {
    // estimate ≥ percent % of value, cross-multiplied to stay in integers (percent has ≤ 2 decimals).
    const percentHundredths = Math.round(rule.percent * 100)
    const total = estimateCents * 10_000 >= percentHundredths * actualCashValueCents
    const thresholdCents = Math.ceil((percentHundredths * actualCashValueCents) / 10_000)
    return {
      recommendation: total ? 'salvage' : 'repair',
      rule: rule.rule,
      numbers: { ...numbers, thresholdCents },
      percent: rule.percent,
      explanation: [
        `The repair estimate is ${estimate}; the vehicle is worth about ${value} before the damage.`,
        `Here a vehicle is a total loss when repairs cost ${rule.percent} % of its value or more: ${formatCents(thresholdCents)}.`,
        total
          ? `The estimate reaches that, so repairing it costs more than the rule allows: salvage is recommended.`
          : `The estimate is below that, so repairing it is worth considering.`,
      ],
      source: rule.source,
    }
  }
  const total = estimateCents + salvageValueCents >= actualCashValueCents
  return {
    recommendation: total ? 'salvage' : 'repair',
    rule: rule.rule,
    numbers: { ...numbers, thresholdCents: Math.max(0, actualCashValueCents - salvageValueCents) },
    explanation: [
      `The repair estimate is ${estimate}; the vehicle is worth about ${value} before the damage, and ${salvage} as salvage.`,
      `Repairing costs ${estimate} and keeps the vehicle; selling it as salvage brings ${salvage}. ` +
        `Together ${formatCents(estimateCents + salvageValueCents)} against a value of ${value}.`,
      total
        ? 'That reaches the value of the vehicle, so repairing it is not worth it: salvage is recommended.'
        : 'That is less than the value of the vehicle, so repairing it is worth considering.',
    ],
    source: rule.source,
  }
}
