import { z } from 'zod'
import { userRowSchema, type CreateUser, type UpdateUser } from '@shared/schemas/users'
import { request, requestEmpty } from './http'

export const listUsers = () => request('GET', '/api/users', z.object({ users: z.array(userRowSchema) })).then((r) => r.users)
export const createUser = (input: CreateUser) => request('POST', '/api/users', z.object({ user: userRowSchema }), input).then((r) => r.user)
export const updateUser = (id: string, input: UpdateUser) =>
  request('PATCH', `/api/users/${id}`, z.object({ user: userRowSchema }), input).then((r) => r.user)
export const resetPassword = (id: string, password: string) => requestEmpty('POST', `/api/users/${id}/password`, { password })
