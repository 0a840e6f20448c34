import { defineStore } from 'pinia'
import type { Role } from '~~/shared/schemas/roles'
import { isStaff } from '~~/shared/schemas/roles'
import { can as roleCan, type Permission } from '~~/shared/utils/permissions'

// The signed-in person's bench: who they are and what their roles let them do.
export const useWorkbenchStore = defineStore('workbench', () => {
  const { user, clear, fetch: refreshSession } = useUserSession()

  const roles = computed<Role[]>(() => (user.value?.roles ?? []) as Role[])
  const has = (...wanted: Role[]) => roles.value.some(r => wanted.includes(r))
  const can = (permission: Permission) => roleCan(roles.value, permission)
  const staff = computed(() => isStaff(roles.value))

  async function signIn(email: string, password: string) {
    await $fetch('/api/auth/login', { method: 'POST', body: { email, password } })
    await forgetKeptPages()
    await refreshSession()
  }

  async function signOut() {
    await $fetch('/api/auth/logout', { method: 'POST' })
    await forgetKeptPages()
    await clear()
    await navigateTo('/login')
  }

  return { user, roles, has, can, staff, signIn, signOut }
})
