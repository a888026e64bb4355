import type { Permission } from '#shared/auth/roles'

// The records with a list page and a page that adds one: the list's title, the adding page's
// title (also the list's "New …" link), where it lives, who may add and what the others are told.
export const LIST_PAGES = {
  sets: { title: 'Sets', newTitle: 'New set', newTo: '/sets/new', permission: 'sets:manage', denied: 'Sets are entered by the office or the owner.' },
  lots: { title: 'Lots', newTitle: 'New lot', newTo: '/lots/new', permission: 'lots:manage', denied: 'Lots are recorded by the office or the owner.' },
  templates: { title: 'Templates', newTitle: 'New template', newTo: '/templates/new', permission: 'templates:manage', denied: 'Only the owner adds and edits ratio templates.' },
} as const satisfies Record<string, { title: string, newTitle: string, newTo: string, permission: Permission, denied: string }>

export type ListKind = keyof typeof LIST_PAGES
