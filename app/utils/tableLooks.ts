// The team screen's roomier tables (base-size text, a small header row, wider cells), for DataTable.
export const TEAM_TABLE = {
  tableClass: 'w-full text-left',
  headClass: 'text-sm text-ink-soft border-b border-paper-line',
  headPad: 'px-4 py-3',
  pad: 'px-4 py-2',
} as const
