import { z } from 'zod'
import { sessionSchema, type SignIn } from '@shared/schemas/session'
import type { Locale } from '@shared/messages/locales'
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

/** The signed-in person's own language, saved with their account; answers with the user as the session now holds it. */
export async function saveLocale(locale: Locale) {
  const res = await request('PUT', '/api/session/locale', z.object({ user: userSchema }), { locale })
  return res.user
}
