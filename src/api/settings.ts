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
import { settingsAuditPageSchema, type SettingsAuditQuery } from '@shared/schemas/settings-audit'
import { request } from './http'
import { vehicleChanged } from './vehicles'

export const settingsKeys = {
  all: ['settings'] as const,
  ruleSets: () => [...settingsKeys.all, 'rule-sets'] as const,
  ruleSet: (id: string) => [...settingsKeys.ruleSets(), id] as const,
  olderVehicles: (id: string) => [...settingsKeys.ruleSets(), id, 'older-vehicles'] as const,
  holidays: (id: string, from: number, to: number) => [...settingsKeys.ruleSets(), id, 'holidays', from, to] as const,
  audit: (query: SettingsAuditQuery) => [...settingsKeys.all, 'audit', query] as const,
}

const holidaysSchema = z.object({ holidays: z.array(z.object({ date: z.string(), name: z.string() })) })

export const fetchRuleSets = () => request('GET', '/api/settings/rule-sets', ruleSetListSchema).then((r) => r.ruleSets)
export const fetchRuleSet = (id: string) => request('GET', `/api/settings/rule-sets/${encodeURIComponent(id)}`, ruleSetDetailSchema)
export const copyRuleSet = (id: string, input: CopyRuleSet) => request('POST', `/api/settings/rule-sets/${encodeURIComponent(id)}/copy`, ruleSetDetailSchema, input)
export const saveRuleSet = (id: string, input: SaveRuleSet) => request('PUT', `/api/settings/rule-sets/${encodeURIComponent(id)}`, ruleSetDetailSchema, input)
export const chooseYardRuleSet = (input: ChooseRuleSet) => request('PUT', '/api/settings/yard-rule-set', ruleSetListSchema, input).then((r) => r.ruleSets)
export const fetchOlderVehicles = (id: string) => request('GET', `/api/settings/rule-sets/${encodeURIComponent(id)}/older-vehicles`, olderVersionVehiclesSchema)
export const moveToLatestVersion = (vehicleId: string, input: MoveToLatestVersion) =>
  request('POST', `/api/vehicles/${vehicleId}/rule-set-version`, z.object({ version: z.number() }), input)
/** The holidays a business-day count skips under a rule set: the preview counts with the server's own list. */
export const fetchHolidays = (id: string, from: number, to: number) =>
  request('GET', `/api/rule-sets/${encodeURIComponent(id)}/holidays?from=${from}&to=${to}`, holidaysSchema).then((r) => r.holidays)
export const fetchSettingsAudit = (query: SettingsAuditQuery) =>
  request('GET', `/api/settings/audit?page=${query.page ?? 1}&pageSize=${query.pageSize ?? 25}`, settingsAuditPageSchema)

export const useRuleSetsQuery = () => useQuery({ queryKey: settingsKeys.ruleSets(), queryFn: fetchRuleSets })

export function useRuleSetQuery(id: MaybeRefOrGetter<string>) {
  return useQuery({ queryKey: computed(() => settingsKeys.ruleSet(toValue(id))), queryFn: () => fetchRuleSet(toValue(id)) })
}

export function useOlderVehiclesQuery(id: MaybeRefOrGetter<string>, enabled: MaybeRefOrGetter<boolean>) {
  return useQuery({ queryKey: computed(() => settingsKeys.olderVehicles(toValue(id))), queryFn: () => fetchOlderVehicles(toValue(id)), enabled: computed(() => toValue(enabled)) })
}

export function useHolidaysQuery(id: MaybeRefOrGetter<string>, from: MaybeRefOrGetter<number>, to: MaybeRefOrGetter<number>) {
  return useQuery({
    queryKey: computed(() => settingsKeys.holidays(toValue(id), toValue(from), toValue(to))),
    queryFn: () => fetchHolidays(toValue(id), toValue(from), toValue(to)),
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
