import type { Role } from '~~/shared/schemas/roles'

// Every screen but sign-in needs a session; a page may also name the roles it is for (definePageMeta roles).
export default defineNuxtRouteMiddleware((to) => {
  const { loggedIn, user } = useUserSession()
  if (to.path === '/login') return loggedIn.value ? navigateTo('/') : undefined
  if (!loggedIn.value) return navigateTo({ path: '/login', query: to.fullPath !== '/' ? { next: to.fullPath } : {} })
  const allowed = to.meta.roles as Role[] | undefined
  if (allowed && !user.value?.roles.some(r => allowed.includes(r))) {
    throw createError({ statusCode: 403, statusMessage: 'This screen is not part of your role.', fatal: true })
  }
})
