import { can, navItemsFor, type Permission, type Role } from '#shared/auth/roles'

/** The signed-in member as the client sees it, with the role checks the screens use. */
export function useMember() {
  const { data, status } = useAuth()
  const config = useRuntimeConfig()
  const role = computed(() => (data.value?.role ?? null) as Role | null)
  return {
    status,
    user: data,
    role,
    can: (permission: Permission) => can(role.value, permission),
    // The Mailbox item only under `nuxt dev`: a production build has no such screen.
    nav: computed(() => navItemsFor(role.value, { dev: import.meta.dev && Boolean(config.public.devMailbox) })),
  }
}
