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
