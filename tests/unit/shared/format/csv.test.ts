import { describe, expect, it } from 'vitest'
import { csvCell, toCsv } from '../../../../shared/format/csv'
import { parseCsv } from '../../../support/csv'

describe('csvCell', () => {
  it('quotes a field holding a comma, a quote or a line break and doubles its quotes', () => {
    // source: RFC 4180, section 2, rules 6 and 7.
    expect(csvCell('a,b')).toBe('"a,b"')
    expect(csvCell('say "hi"')).toBe('"say ""hi"""')
    expect(csvCell('two\nlines')).toBe('"two\nlines"')
    expect(csvCell('plain')).toBe('plain')
  })

  it('puts an apostrophe before text a spreadsheet would run as a formula', () => {
    // source: OWASP, "CSV Injection" (cells starting with = + - @, tab or carriage return).
    expect(csvCell('=1+1')).toBe('\'=1+1')
    expect(csvCell('+44 20')).toBe('\'+44 20')
    expect(csvCell('-2')).toBe('\'-2')
    expect(csvCell('@SUM(A1)')).toBe('\'@SUM(A1)')
    expect(csvCell('=HYPERLINK("x","y")')).toBe('"\'=HYPERLINK(""x"",""y"")"')
  })

  it('writes numbers as numbers, negative ones too, and empty for null or not finite', () => {
    expect(csvCell(-12.5)).toBe('-12.5')
    expect(csvCell(null)).toBe('')
    expect(csvCell(undefined)).toBe('')
    expect(csvCell(Number.NaN)).toBe('')
  })
})

describe('toCsv', () => {
  it('round-trips through an independent RFC 4180 reader', () => {
    const rows = [['C4', 'fundamental, "1"', -3.2], ['E4', 'line\r\nbreak', null]]
    const text = toCsv(['note', 'partial', 'deviation_cents'], rows)
    // source: RFC 4180, section 2, rule 1 (CRLF line ends).
    expect(text.endsWith('\r\n')).toBe(true)
    expect(parseCsv(text)).toEqual([
      ['note', 'partial', 'deviation_cents'],
      ['C4', 'fundamental, "1"', '-3.2'],
      ['E4', 'line\r\nbreak', ''],
    ])
  })
})
