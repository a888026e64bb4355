import { computed } from 'vue'
import { LIST_PAGES, type ListKind } from '~/utils/listPages'
import { useMember } from './useMember'

/**
 * A record list's page or its adding page: the words from LIST_PAGES, the tab's title, whether the
 * member may add, and what an empty list says next (the "New …" link, or who adds them).
 */
export function useListPage(kind: ListKind, which: 'list' | 'new') {
  const page = LIST_PAGES[kind]
  const title = which === 'list' ? page.title : page.newTitle
  const { can } = useMember()
  useHead({ title: `${title} · Tonewright` })
  const mayAdd = computed(() => can(page.permission))
  const empty = computed(() => ({
    text: mayAdd.value ? page.empty : `${page.empty} ${page.denied}`,
    next: mayAdd.value ? { to: page.newTo, label: page.newTitle } : null,
  }))
  return { page, title, mayAdd, empty }
}
