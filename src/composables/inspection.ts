import { useQuery, useQueryClient } from '@tanstack/vue-query'
import { computed, reactive, ref, type Ref } from 'vue'
import type { InspectionPage } from '@shared/schemas/inspections'
import { fetchInspection } from '@/api/inspections'
import { ApiError } from '@/api/http'

export interface Problem {
  title: string
  reasons: string[]
}

/**
 * The teardown page from the server, and one way to change it: each call answers with the whole
 * page, which replaces the cached one, and the board and vehicle page are told to look again.
 */
export function useInspection(vehicleId: Ref<string>) {
  const queryClient = useQueryClient()
  const key = computed(() => ['inspection', vehicleId.value])
  const query = useQuery({ queryKey: key, queryFn: () => fetchInspection(vehicleId.value) })
  const busy = ref<string | null>(null)
  const problem = ref<Problem | null>(null)
  /** Per-field messages from the last refusal (`issues[].path`). */
  const errors = reactive<Record<string, string>>({})

  function apply(page: InspectionPage) {
    queryClient.setQueryData(key.value, page)
    void queryClient.invalidateQueries({ queryKey: ['board'] })
    void queryClient.invalidateQueries({ queryKey: ['vehicle', vehicleId.value] })
  }

  async function run(what: string, call: () => Promise<InspectionPage>): Promise<boolean> {
    busy.value = what
    problem.value = null
    for (const k of Object.keys(errors)) delete errors[k]
    try {
      apply(await call())
      return true
    } catch (e) {
      const issues = e instanceof ApiError ? e.issues : []
      for (const i of issues) errors[i.path] ??= i.message
      problem.value = { title: 'Not saved', reasons: issues.length > 1 ? issues.map((i) => i.message) : [(e as Error).message] }
      return false
    } finally {
      busy.value = null
    }
  }

  return { query, page: query.data, busy, problem, errors, run, apply }
}
