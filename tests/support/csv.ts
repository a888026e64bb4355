/**
 * A small RFC 4180 reader for tests: quoted fields (with "" for a quote, commas and
 * line breaks inside), CRLF or LF line ends. Written from the RFC's grammar (source: RFC 4180, section 2),
 * separately from the writer it checks.
 */
export function parseCsv(text: string): string[][] {
  const rows: string[][] = []
  let row: string[] = []
  let field = ''
  let quoted = false
  let i = 0
  while (i < text.length) {
    const c = text[i]!
    if (quoted) {
      if (c === '"' && text[i + 1] === '"') {
        field += '"'
        i += 2
        continue
      }
      if (c === '"') quoted = false
      else field += c
      i++
      continue
    }
    if (c === '"' && field === '') quoted = true
    else if (c === ',') {
      row.push(field)
      field = ''
    }
    else if (c === '\n' || c === '\r') {
      row.push(field)
      rows.push(row)
      row = []
      field = ''
      if (c === '\r' && text[i + 1] === '\n') i++
    }
    else field += c
    i++
  }
  if (quoted) throw new Error('CSV: a quoted field is not closed')
  if (field !== '' || row.length) {
    row.push(field)
    rows.push(row)
  }
  return rows
}

/** Rows as objects keyed by the header row. */
export function csvRecords(text: string): Record<string, string>[] {
  const [header, ...rows] = parseCsv(text)
  if (!header) return []
  return rows.map(r => Object.fromEntries(header.map((h, i) => [h, r[i] ?? ''])))
}
