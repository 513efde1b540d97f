import { defineStore } from 'pinia'
import { computed, ref } from 'vue'
import { can, type Permission } from '@shared/domain/access'
import type { SignIn } from '@shared/schemas/session'
import type { User } from '@shared/schemas/users'
import * as api from '@/api/session'

export const useSessionStore = defineStore('session', () => {
  const user = ref<User | null>(null)
  const loaded = ref(false)

  async function load() {
    const state = await api.fetchSession()
    user.value = state.user
    loaded.value = true
  }

  async function signIn(input: SignIn) {
    user.value = await api.signIn(input)
  }

  async function signOut() {
    await api.signOut()
    user.value = null
    // A fresh anonymous session and token for the next sign-in.
    await load()
  }

  const signedIn = computed(() => user.value !== null)
  const allows = (permission: Permission) => can(user.value?.role, permission)

  return { user, loaded, signedIn, load, signIn, signOut, allows }
})
