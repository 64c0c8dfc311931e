import type { SignInBody, SignUpBody, User } from '@shared/api/schemas'
import { acceptHMRUpdate, defineStore } from 'pinia'
import { computed, ref } from 'vue'
import * as api from '@/api/auth'
import { setUnauthorizedListener } from '@/api/http'

/** The signed-in user. `hydrate()` asks the server once per page load. */
export const useAuthStore = defineStore('auth', () => {
  const user = ref<User | null>(null)
  const hydrated = ref(false)
  const signedIn = computed(() => user.value !== null)

  setUnauthorizedListener(() => {
    user.value = null
  })

  async function hydrate() {
    if (hydrated.value) return
    try {
      user.value = await api.fetchMe()
    } catch {
      user.value = null
    }
    hydrated.value = true
  }

  async function signIn(body: SignInBody) {
    user.value = await api.signIn(body)
    hydrated.value = true
  }

  async function signUp(body: SignUpBody) {
    user.value = await api.signUp(body)
    hydrated.value = true
  }

  async function signOut() {
    try {
      await api.signOut()
    } finally {
      user.value = null
    }
  }

  return { user, hydrated, signedIn, hydrate, signIn, signUp, signOut }
})

if (import.meta.hot) import.meta.hot.accept(acceptHMRUpdate(useAuthStore, import.meta.hot))
