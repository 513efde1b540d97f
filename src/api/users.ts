import { useMutation, useQuery } from '@tanstack/vue-query'
import { z } from 'zod'
import { userRowSchema, type CreateUser, type StaffYards, type UpdateUser } from '@shared/schemas/users'
import { request, requestEmpty } from './http'

export const userKeys = {
  all: ['users'] as const,
}

export const listUsers = () => request('GET', '/api/users', z.object({ users: z.array(userRowSchema) })).then((r) => r.users)
export const createUser = (input: CreateUser) => request('POST', '/api/users', z.object({ user: userRowSchema }), input).then((r) => r.user)
export const updateUser = (id: string, input: UpdateUser) =>
  request('PATCH', `/api/users/${id}`, z.object({ user: userRowSchema }), input).then((r) => r.user)
export const resetPassword = (id: string, password: string) => requestEmpty('POST', `/api/users/${id}/password`, { password })

export const useUsersQuery = () => useQuery({ queryKey: userKeys.all, queryFn: listUsers })

/** A new staff member: resolves once the list has been fetched again with them in it. */
export function useCreateUserMutation() {
  return useMutation({
    mutationFn: createUser,
    onSuccess: (_user, _input, _context, { client }) => client.invalidateQueries({ queryKey: userKeys.all }),
  })
}

/** A new role, or deactivated / reactivated: the list is fetched again either way, to show what the server kept. */
export function useUpdateUserMutation() {
  return useMutation({
    mutationFn: ({ id, input }: { id: string; input: UpdateUser }) => updateUser(id, input),
    onSettled: (_user, _error, _vars, _context, { client }) => client.invalidateQueries({ queryKey: userKeys.all }),
  })
}

/** Changes nothing the list shows (the server ends their sessions). */
export const useResetPasswordMutation = () => useMutation({ mutationFn: ({ id, password }: { id: string; password: string }) => resetPassword(id, password) })

export const setStaffYards = (id: string, input: StaffYards) => request('PUT', `/api/users/${id}/yards`, z.object({ user: userRowSchema }), input).then((r) => r.user)

/** A person's yards (all, or the ones chosen): the Staff list is fetched again to show what the server kept. */
export function useStaffYardsMutation() {
  return useMutation({
    mutationFn: ({ id, input }: { id: string; input: StaffYards }) => setStaffYards(id, input),
    onSettled: (_user, _error, _vars, _context, { client }) => client.invalidateQueries({ queryKey: userKeys.all }),
  })
}
