import type { Permission } from '#shared/auth/roles'

// The records with a list page and a page that adds one: the list's title, the adding page's
// title (also the list's "New …" link), where it lives, who may add, what the others are told and
// what an empty list says.
export const LIST_PAGES = {
  sets: { title: 'Sets', newTitle: 'New set', newTo: '/sets/new', permission: 'sets:manage', denied: 'Sets are entered by the office or the owner.', empty: 'No set yet: an order becomes a set with its buyer, range and template.' },
  lots: { title: 'Lots', newTitle: 'New lot', newTo: '/lots/new', permission: 'lots:manage', denied: 'Lots are recorded by the office or the owner.', empty: 'No lot yet: record a delivery of wood or metal with its supplier and papers.' },
  templates: { title: 'Templates', newTitle: 'New template', newTo: '/templates/new', permission: 'templates:manage', denied: 'Only the owner adds and edits ratio templates.', empty: 'No ratio template yet: a set needs one for its pieces.' },
} as const satisfies Record<string, { title: string, newTitle: string, newTo: string, permission: Permission, denied: string, empty: string }>

export type ListKind = keyof typeof LIST_PAGES
