import { keepPreviousData, useMutation, useQuery } from '@tanstack/vue-query'
import { computed, toValue, type MaybeRefOrGetter } from 'vue'
import { z } from 'zod'
import {
  olderVersionVehiclesSchema,
  ruleSetDetailSchema,
  ruleSetListSchema,
  type ChooseRuleSet,
  type CopyRuleSet,
  type MoveToLatestVersion,
  type SaveRuleSet,
} from '@shared/schemas/rule-set-editor'
import { holidayCalendarListSchema, holidayListSchema } from '@shared/schemas/holidays'
import { settingsAuditPageSchema, type SettingsAuditQuery } from '@shared/schemas/settings-audit'
import { request } from './http'
import { vehicleChanged } from './vehicles'

export const settingsKeys = {
  all: ['settings'] as const,
  ruleSets: () => [...settingsKeys.all, 'rule-sets'] as const,
  ruleSet: (id: string) => [...settingsKeys.ruleSets(), id] as const,
  olderVehicles: (id: string) => [...settingsKeys.ruleSets(), id, 'older-vehicles'] as const,
  // Outside `all`: a saved setting never changes which holidays a calendar closes.
  holidayCalendars: () => ['holiday-calendars'] as const,
  draftHolidays: (calendars: string, from: number, to: number) => ['holidays', calendars, from, to] as const,
  audit: (query: SettingsAuditQuery) => [...settingsKeys.all, 'audit', query] as const,
}

export const fetchRuleSets = () => request('GET', '/api/settings/rule-sets', ruleSetListSchema).then((r) => r.ruleSets)
export const fetchRuleSet = (id: string) => request('GET', `/api/settings/rule-sets/${encodeURIComponent(id)}`, ruleSetDetailSchema)
export const copyRuleSet = (id: string, input: CopyRuleSet) => request('POST', `/api/settings/rule-sets/${encodeURIComponent(id)}/copy`, ruleSetDetailSchema, input)
export const saveRuleSet = (id: string, input: SaveRuleSet) => request('PUT', `/api/settings/rule-sets/${encodeURIComponent(id)}`, ruleSetDetailSchema, input)
export const chooseYardRuleSet = (input: ChooseRuleSet) => request('PUT', '/api/settings/yard-rule-set', ruleSetListSchema, input).then((r) => r.ruleSets)
export const fetchOlderVehicles = (id: string) => request('GET', `/api/settings/rule-sets/${encodeURIComponent(id)}/older-vehicles`, olderVersionVehiclesSchema)
export const moveToLatestVersion = (vehicleId: string, input: MoveToLatestVersion) =>
  request('POST', `/api/vehicles/${vehicleId}/rule-set-version`, z.object({ version: z.number() }), input)
/** The calendars the server's holiday source knows (the editor's choices). */
export const fetchHolidayCalendars = () => request('GET', '/api/settings/holiday-calendars', holidayCalendarListSchema).then((r) => r.calendars)
/** The holidays closed by every calendar listed ("US/CA,US"): the preview of a draft before it is saved. */
export const fetchDraftHolidays = (calendars: string, from: number, to: number) =>
  request('GET', `/api/settings/holidays?calendars=${encodeURIComponent(calendars)}&from=${from}&to=${to}`, holidayListSchema).then((r) => r.holidays)
export const fetchSettingsAudit = (query: SettingsAuditQuery) =>
  request('GET', `/api/settings/audit?page=${query.page ?? 1}&pageSize=${query.pageSize ?? 25}`, settingsAuditPageSchema)

export const useRuleSetsQuery = () => useQuery({ queryKey: settingsKeys.ruleSets(), queryFn: fetchRuleSets })

export function useRuleSetQuery(id: MaybeRefOrGetter<string>) {
  return useQuery({ queryKey: computed(() => settingsKeys.ruleSet(toValue(id))), queryFn: () => fetchRuleSet(toValue(id)) })
}

export function useOlderVehiclesQuery(id: MaybeRefOrGetter<string>, enabled: MaybeRefOrGetter<boolean>) {
  return useQuery({ queryKey: computed(() => settingsKeys.olderVehicles(toValue(id))), queryFn: () => fetchOlderVehicles(toValue(id)), enabled: computed(() => toValue(enabled)) })
}

export const useHolidayCalendarsQuery = () => useQuery({ queryKey: settingsKeys.holidayCalendars(), queryFn: fetchHolidayCalendars, staleTime: Infinity })

export function useDraftHolidaysQuery(calendars: MaybeRefOrGetter<string>, from: MaybeRefOrGetter<number>, to: MaybeRefOrGetter<number>) {
  return useQuery({
    queryKey: computed(() => settingsKeys.draftHolidays(toValue(calendars), toValue(from), toValue(to))),
    queryFn: () => fetchDraftHolidays(toValue(calendars), toValue(from), toValue(to)),
    enabled: computed(() => toValue(calendars) !== ''),
    staleTime: Infinity,
    placeholderData: keepPreviousData,
  })
}

export function useSettingsAuditQuery(query: MaybeRefOrGetter<SettingsAuditQuery>) {
  return useQuery({ queryKey: computed(() => settingsKeys.audit(toValue(query))), queryFn: () => fetchSettingsAudit(toValue(query)), placeholderData: keepPreviousData })
}

/** Every settings change is in the audit and may change the list: both are fetched again. */
export function useCopyRuleSetMutation() {
  return useMutation({
    mutationFn: ({ id, input }: { id: string; input: CopyRuleSet }) => copyRuleSet(id, input),
    onSuccess: (_d, _v, _c, { client }) => client.invalidateQueries({ queryKey: settingsKeys.all }),
  })
}

export function useSaveRuleSetMutation() {
  return useMutation({
    mutationFn: ({ id, input }: { id: string; input: SaveRuleSet }) => saveRuleSet(id, input),
    onSuccess: (saved, { id }, _c, { client }) => {
      client.setQueryData(settingsKeys.ruleSet(id), saved)
      return client.invalidateQueries({ queryKey: settingsKeys.all })
    },
  })
}

export function useChooseYardRuleSetMutation() {
  return useMutation({
    mutationFn: chooseYardRuleSet,
    onSuccess: (_d, _v, _c, { client }) => client.invalidateQueries({ queryKey: settingsKeys.all }),
  })
}

export function useMoveToLatestVersionMutation() {
  return useMutation({
    mutationFn: ({ vehicleId, input }: { vehicleId: string; input: MoveToLatestVersion }) => moveToLatestVersion(vehicleId, input),
    onSuccess: (_d, { vehicleId }, _c, { client }) => Promise.all([vehicleChanged(client, vehicleId), client.invalidateQueries({ queryKey: settingsKeys.all })]),
  })
}
