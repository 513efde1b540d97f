import { defineStore } from 'pinia'
import { computed, ref } from 'vue'
import { can, type Permission } from '@shared/domain/access'
import type { Locale } from '@shared/messages/locales'
import type { SignIn } from '@shared/schemas/session'
import type { User } from '@shared/schemas/users'
import { onSessionEnded } from '@/api/http'
import * as api from '@/api/session'
import { useLocaleStore } from './locale'

export const useSessionStore = defineStore('session', () => {
  const user = ref<User | null>(null)
  const loaded = ref(false)
  /** The session ended while a page was open: the page stays, and asks its person to sign in again. */
  const ended = ref(false)
  const locale = useLocaleStore()
  onSessionEnded(() => {
    if (user.value) ended.value = true
  })

  // A person who chose a language works in it on every device they sign in on.
  function takeLocale(u: User | null) {
    if (u?.locale) locale.choose(u.locale)
  }

  async function load() {
    const state = await api.fetchSession()
    user.value = state.user
    takeLocale(state.user)
    loaded.value = true
  }

  async function signIn(input: SignIn) {
    user.value = await api.signIn(input)
    ended.value = false
    takeLocale(user.value)
  }

  /** Whether the server still knows this person (a live stream that broke may only mean signed out). */
  async function check() {
    const state = await api.fetchSession()
    if (user.value && !state.user) ended.value = true
  }

  /** Signs the same person in again over the page they were on: a fresh token first, then the password. */
  async function resume(password: string) {
    await api.fetchSession()
    await signIn({ email: user.value!.email, password })
  }

  /** Someone else will sign in: the page is left for the sign-in page. */
  function forget() {
    user.value = null
    ended.value = false
  }

  /** Switches the language at once; signed in, it is also saved with the account (kept on this device if that fails). */
  async function chooseLocale(next: Locale) {
    locale.choose(next)
    if (!user.value || user.value.locale === next) return
    try {
      user.value = await api.saveLocale(next)
    } catch {
      // Offline or signed out meanwhile: this device keeps the choice, the account its last one.
    }
  }

  async function signOut() {
    await api.signOut().catch(() => undefined)
    user.value = null
    ended.value = false
    // A fresh anonymous session and token for the next sign-in.
    await load()
  }

  const signedIn = computed(() => user.value !== null)
  const allows = (permission: Permission) => can(user.value?.role, permission)

  return { user, loaded, ended, signedIn, load, signIn, check, resume, forget, signOut, allows, chooseLocale }
})
