import type { DataTableProps } from '~/components/data/DataTable.vue'

// The team screen's roomier tables (base-size text, a small header row, wider cells), for DataTable.
export const TEAM_TABLE = {
  tableClass: 'w-full text-left',
  headClass: 'text-sm text-ink-soft border-b border-paper-line',
  headPad: 'px-4 py-3',
  pad: 'px-4 py-2',
} as const

// The verification page's piece table: faint header, rows ruled below, cells top-aligned.
export const RULED_TABLE = {
  tableClass: 'w-full text-sm',
  headClass: 'text-left text-ink-faint border-b border-paper-line',
  pad: 'py-2 pr-3',
  rowClass: 'border-b border-paper-line align-top',
} as const

// A template's partials: a tight table inside a card, rows ruled above.
export const TIGHT_TABLE = {
  tableClass: 'w-full text-sm text-left',
  headClass: 'text-ink-soft',
  pad: 'py-1 pr-3',
  rowClass: 'border-t border-paper-line',
} as const

// The bench's upload list: faint header, rows ruled above, cells top-aligned.
export const UPLOAD_TABLE = {
  tableClass: 'w-full text-sm',
  headClass: 'text-left text-ink-faint',
  headPad: 'py-1',
  pad: 'py-2',
  rowClass: 'border-t border-paper-line align-top',
} as const

/**
 * A table's fixed parts, declared once beside its columns: how a row is keyed, its look (one of
 * the looks above, or DataTable's own), its test ids, its empty line and whether it scrolls
 * sideways. DataTable takes it with `v-bind`, the rows beside it.
 */
export type TableSpec<R> = Omit<DataTableProps<R>, 'rows'>

export function tableOf<R>(spec: TableSpec<R>): TableSpec<R> {
  return spec
}
