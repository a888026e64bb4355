/**
 * Roles and what each may do. One table, used by the server to answer 403 and by
 * the client to hide what a role cannot use (README.md, Roles and stages: owner,
 * supervisor, benchmaker, office).
 */
import { keysOf } from '../records/lists'

export const ROLE_LABELS = {
  owner: 'Owner',
  supervisor: 'Supervisor',
  benchmaker: 'Benchmaker',
  office: 'Office',
}
export const ROLES = keysOf(ROLE_LABELS)
export type Role = (typeof ROLES)[number]

export const PERMISSIONS = {
  'workshop:read': ['owner', 'supervisor', 'benchmaker', 'office'],
  'workshop:manage': ['owner'],
  'team:read': ['owner', 'supervisor', 'benchmaker', 'office'],
  'team:manage': ['owner'],
  'templates:read': ['owner', 'supervisor', 'benchmaker', 'office'],
  'templates:manage': ['owner'],
  'pieces:read': ['owner', 'supervisor', 'benchmaker', 'office'],
  'pieces:stage': ['owner', 'supervisor', 'benchmaker'],
  'pieces:assign': ['owner', 'supervisor'],
  'bench:strike': ['owner', 'supervisor', 'benchmaker'],
  'review:decide': ['owner', 'supervisor'],
  /** Re-measure stored strikes with the current engine (keeps every old result). */
  'strikes:reanalyze': ['owner', 'supervisor'],
  'sets:read': ['owner', 'supervisor', 'benchmaker', 'office'],
  'sets:manage': ['owner', 'office'],
  'sets:ship': ['owner', 'office'],
  /** Download a set's results as CSV for the workshop's own spreadsheets. */
  'sets:export': ['owner', 'supervisor', 'office'],
  'lots:manage': ['owner', 'office'],
  'certificates:read': ['owner', 'supervisor', 'office'],
  'certificates:sign': ['owner', 'supervisor'],
  'certificates:send': ['owner', 'office'],
} as const satisfies Record<string, readonly Role[]>

export type Permission = keyof typeof PERMISSIONS

export function isRole(value: unknown): value is Role {
  return typeof value === 'string' && (ROLES as readonly string[]).includes(value)
}

/** True when the role holds the permission; unknown roles hold nothing. */
export function can(role: Role | null | undefined, permission: Permission): boolean {
  if (!role || !isRole(role)) return false
  return (PERMISSIONS[permission] as readonly Role[]).includes(role)
}

/**
 * The roles a member may give others, by adding or inviting them: whoever manages
 * the team gives any role, everyone else none. An invitation is only as good as
 * this answer for its inviter at the moment it is accepted.
 */
export function rolesAssignableBy(role: Role | null | undefined): readonly Role[] {
  return can(role, 'team:manage') ? ROLES : []
}

export interface NavItem {
  label: string
  to: string
  permission: Permission
  devOnly?: boolean
}

/** The navigation, in the order README.md lists it (Roles and stages). */
export const NAV_ITEMS: readonly NavItem[] = [
  { label: 'Bench', to: '/bench', permission: 'bench:strike' },
  { label: 'Pieces', to: '/pieces', permission: 'pieces:read' },
  { label: 'Sets', to: '/sets', permission: 'sets:read' },
  { label: 'Lots', to: '/lots', permission: 'pieces:read' },
  { label: 'Review', to: '/review', permission: 'review:decide' },
  { label: 'Templates', to: '/templates', permission: 'templates:read' },
  { label: 'Certificates', to: '/certificates', permission: 'certificates:read' },
  { label: 'Team', to: '/team', permission: 'team:read' },
  { label: 'Settings', to: '/settings', permission: 'workshop:manage' },
  { label: 'Mailbox', to: '/mailbox', permission: 'workshop:read', devOnly: true },
]

export function navItemsFor(role: Role | null | undefined, options: { dev?: boolean } = {}): NavItem[] {
  return NAV_ITEMS.filter(item => can(role, item.permission) && (!item.devOnly || options.dev === true))
}

/** Pages under a navigation item that a different permission opens: whoever strikes calibrates the inputs they strike with. */
const PAGE_PERMISSIONS: Readonly<Record<string, Permission>> = { '/settings/calibrations': 'bench:strike' }

/** The permission a page path needs, from the navigation table (undefined for open pages). */
export function permissionForPath(path: string): Permission | undefined {
  const own = PAGE_PERMISSIONS[path.replace(/\/+$/, '')]
  if (own) return own
  const item = NAV_ITEMS.find(i => path === i.to || path.startsWith(`${i.to}/`))
  return item?.permission
}
