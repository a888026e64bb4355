/** A CSV cell: text, a number, or empty. */
export type CsvValue = string | number | null | undefined

/** Characters that make a spreadsheet read a text cell as a formula (OWASP "CSV Injection"; tab and CR too). */
const FORMULA_START = /^[=+\-@\t\r]/

/**
 * One cell, RFC 4180: quoted when it holds a comma, a quote or a line break, quotes doubled.
 * Text that a spreadsheet would run as a formula gets a leading apostrophe; numbers are
 * written as numbers (a negative deviation stays a number).
 */
export function csvCell(value: CsvValue): string {
  if (value === null || value === undefined) return ''
  if (typeof value === 'number') return Number.isFinite(value) ? String(value) : ''
  const text = FORMULA_START.test(value) ? `'${value}` : value
  return /[",\r\n]/.test(text) ? `"${text.replace(/"/g, '""')}"` : text
}

/** A whole CSV text: header then rows, CRLF line ends as RFC 4180 writes them. */
export function toCsv(header: readonly string[], rows: readonly CsvValue[][]): string {
  return [header, ...rows].map(row => row.map(csvCell).join(',')).join('\r\n') + '\r\n'
}
