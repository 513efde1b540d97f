import { keepPreviousData, useQuery } from '@tanstack/vue-query'
import { computed, toValue, type MaybeRefOrGetter } from 'vue'
import { agedSchema, dailyReportSchema, salvageSchema, receivablesSchema, type AgedQuery, type ReceivablesQuery } from '@shared/schemas/reports'
import { request } from './http'

export type ReceivablesFilters = Partial<ReceivablesQuery>

export const reportKeys = {
  all: ['reports'] as const,
  receivables: (q: ReceivablesFilters) => [...reportKeys.all, 'receivables', q] as const,
  aged: (q: AgedQuery) => [...reportKeys.all, 'aged', q] as const,
  daily: (date: string | undefined) => [...reportKeys.all, 'daily', date ?? 'today'] as const,
  salvage: (month: string | undefined) => [...reportKeys.all, 'salvage', month ?? 'last'] as const,
}

/** The query string of a receivables request: only what is set. */
export function receivablesParams(q: ReceivablesFilters): string {
  const params = new URLSearchParams()
  for (const [k, v] of Object.entries(q)) if (v !== undefined && v !== '' && v !== null) params.set(k, String(v))
  return params.toString()
}

export const fetchReceivables = (q: ReceivablesFilters) => request('GET', `/api/reports/receivables?${receivablesParams(q)}`, receivablesSchema)

/** Where the same rows download as CSV (the session opens it; paging is ignored there). */
export const receivablesCsvUrl = (q: ReceivablesFilters) => `/api/reports/receivables.csv?${receivablesParams({ ...q, page: undefined, pageSize: undefined })}`

/** One page of receivables; the last page stays shown while the next loads. */
export const useReceivablesQuery = (q: MaybeRefOrGetter<ReceivablesFilters>) =>
  useQuery({ queryKey: computed(() => reportKeys.receivables(toValue(q))), queryFn: () => fetchReceivables(toValue(q)), placeholderData: keepPreviousData })

export const fetchAged = (q: AgedQuery) => request('GET', `/api/reports/aged?over=${q.over}&page=${q.page}&pageSize=${q.pageSize}`, agedSchema)
export const useAgedQuery = (q: MaybeRefOrGetter<AgedQuery>) =>
  useQuery({ queryKey: computed(() => reportKeys.aged(toValue(q))), queryFn: () => fetchAged(toValue(q)), placeholderData: keepPreviousData })

export const fetchDaily = (date: string | undefined) => request('GET', `/api/reports/daily${date ? `?date=${date}` : ''}`, dailyReportSchema)
export const useDailyQuery = (date: MaybeRefOrGetter<string | undefined>) =>
  useQuery({ queryKey: computed(() => reportKeys.daily(toValue(date))), queryFn: () => fetchDaily(toValue(date)) })

/** The day's report as a PDF in the reader's language (the session opens it). */
export const dailyPdfUrl = (date: string, lang: string) => `/api/reports/daily.pdf?date=${date}&lang=${lang}`

export const fetchSalvage = (month: string | undefined) => request('GET', `/api/reports/salvage${month ? `?month=${month}` : ''}`, salvageSchema)
export const useSalvageQuery = (month: MaybeRefOrGetter<string | undefined>) =>
  useQuery({ queryKey: computed(() => reportKeys.salvage(toValue(month))), queryFn: () => fetchSalvage(toValue(month)) })
export const salvageCsvUrl = (month: string) => `/api/reports/salvage.csv?month=${month}`
/** The same month as a PDF in the reader's language (28 CFR 25.56, with the legal caution). */
export const salvagePdfUrl = (month: string, lang: string) => `/api/reports/salvage.pdf?month=${month}&lang=${lang}`
