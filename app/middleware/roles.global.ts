import { can, permissionForPath, type Role } from '#shared/auth/roles'

/**
 * Runs after the sign-in middleware: a signed-in member who opens a screen their
 * role cannot use is sent home with a note instead of seeing a broken page.
 */
export default defineNuxtRouteMiddleware((to) => {
  const { data, status } = useAuth()
  if (status.value !== 'authenticated') return
  // A temporary password from the owner is changed before anything else.
  // Public pages (the certificate check) stay open whatever the account's state.
  if (data.value?.mustChangePassword && to.path !== '/account/password' && to.meta.auth !== false) return navigateTo('/account/password')
  const permission = permissionForPath(to.path)
  if (permission && !can((data.value?.role ?? null) as Role | null, permission)) {
    return navigateTo({ path: '/', query: { denied: to.path } })
  }
})
