import { z } from 'zod'
import { sessionSchema, type SignIn } from '@shared/schemas/session'
import { userSchema } from '@shared/schemas/users'
import { request, requestEmpty, setCsrfToken } from './http'

export async function fetchSession() {
  const state = await request('GET', '/api/session', sessionSchema)
  setCsrfToken(state.csrfToken)
  return state
}

export async function signIn(input: SignIn) {
  const res = await request('POST', '/api/session', z.object({ user: userSchema, csrfToken: z.string() }), input)
  setCsrfToken(res.csrfToken)
  return res.user
}

export const signOut = () => requestEmpty('DELETE', '/api/session')
