import { can, type Permission } from '~~/shared/utils/permissions'

// Every screen but sign-in needs a session; a page may also name the permission it needs (definePageMeta
// permission, from shared/utils/permissions.ts).
export default defineNuxtRouteMiddleware((to) => {
  const { loggedIn, user } = useUserSession()
  if (to.path === '/login') return loggedIn.value ? navigateTo('/') : undefined
  if (!loggedIn.value) return navigateTo({ path: '/login', query: to.fullPath !== '/' ? { next: to.fullPath } : {} })
  const permission = to.meta.permission as Permission | undefined
  if (permission && !can(user.value?.roles ?? [], permission)) {
    throw createError({ statusCode: 403, statusMessage: 'This screen is not part of your role.', fatal: true })
  }
})
