import { reactive, ref, type Ref } from 'vue'
import type { InspectionPage } from '@shared/schemas/inspections'
import { ApiError } from '@/api/http'
import { useInspectionMutation, useInspectionQuery } from '@/api/inspections'
import { i18n } from '@/i18n'

export interface Problem {
  title: string
  reasons: string[]
}

/** A refusal put in the technician's words; the fields it names get their own messages beside them. */
export function problemOf(e: unknown, inline: readonly string[] = []): Problem | null {
  const { t } = i18n.global
  const notSaved = t('inspections.problem.notSaved')
  if (!(e instanceof ApiError)) return { title: notSaved, reasons: [(e as Error).message] }
  // A move made against an older version: the server's words point at the board, not this page.
  if (e.status === 409 && 'current' in e.body) {
    return { title: t('inspections.problem.changedElsewhere'), reasons: [t('inspections.problem.theirChange')] }
  }
  if (e.status === 409) return { title: notSaved, reasons: [e.message, t('inspections.problem.asItIs')] }
  if (e.issues.length === 0) return { title: notSaved, reasons: [e.message] }
  // The top-level message of a 400 names fields by their code names; each issue has its own words.
  const elsewhere = [...new Set(e.issues.filter((i) => !inline.includes(i.path)).map((i) => i.message))]
  return elsewhere.length ? { title: notSaved, reasons: elsewhere } : null
}

/**
 * The teardown page from the server, and one way to change it (useInspectionMutation: each call
 * answers with the whole page), with what is being saved and why a change was refused.
 */
export function useInspection(vehicleId: Ref<string>) {
  const query = useInspectionQuery(vehicleId)
  const change = useInspectionMutation(vehicleId)
  const busy = ref<string | null>(null)
  const problem = ref<Problem | null>(null)
  /** Per-field messages from the last refusal (`issues[].path`). */
  const errors = reactive<Record<string, string>>({})

  /** `inline`: the issue paths the caller shows beside their fields, so no popup covers them. */
  async function run(what: string, call: () => Promise<InspectionPage>, inline: readonly string[] = []): Promise<boolean> {
    busy.value = what
    problem.value = null
    for (const k of Object.keys(errors)) delete errors[k]
    try {
      await change.mutateAsync(call)
      return true
    } catch (e) {
      for (const i of e instanceof ApiError ? e.issues : []) errors[i.path] ??= i.message
      problem.value = problemOf(e, inline)
      return false
    } finally {
      busy.value = null
    }
  }

  return { query, page: query.data, busy, problem, errors, run }
}
