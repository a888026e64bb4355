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
    nav: computed(() => navItemsFor(role.value, { dev: Boolean(config.public.devMailbox) })),
  }
}
