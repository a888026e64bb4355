import { describe, expect, it } from 'vitest'
import { parseByteRange } from '../../../../server/utils/byte-range'

describe('parseByteRange', () => {
  // source: RFC 9110 §14.1.2, the worked examples for a representation of 10000 bytes
  it('reads the RFC\'s examples for a 10000-byte representation', () => {
    expect(parseByteRange('bytes=0-499', 10000)).toEqual({ kind: 'range', range: { start: 0, end: 499 } })
    expect(parseByteRange('bytes=500-999', 10000)).toEqual({ kind: 'range', range: { start: 500, end: 999 } })
    expect(parseByteRange('bytes=-500', 10000)).toEqual({ kind: 'range', range: { start: 9500, end: 9999 } })
    expect(parseByteRange('bytes=9500-', 10000)).toEqual({ kind: 'range', range: { start: 9500, end: 9999 } })
  })

  // source: RFC 9110 §14.1.2 (a last position past the end is taken as the end; a suffix longer than the representation is all of it)
  it('clamps a last position or a suffix past the end', () => {
    expect(parseByteRange('bytes=0-99999', 10000)).toEqual({ kind: 'range', range: { start: 0, end: 9999 } })
    expect(parseByteRange('bytes=-20000', 10000)).toEqual({ kind: 'range', range: { start: 0, end: 9999 } })
    expect(parseByteRange('bytes=0-9999999999999999999999', 10)).toEqual({ kind: 'range', range: { start: 0, end: 9 } })
  })

  it('asks for the whole object without a header', () => {
    expect(parseByteRange(undefined, 10)).toEqual({ kind: 'whole' })
  })

  // source: RFC 9110 §14.1.1 (a range whose last position is below its first is invalid) and §15.5.17 (416 when none can be satisfied)
  it.each([
    ['bytes=500-499', 'ends before it starts'],
    ['bytes=10000-', 'starts past the end'],
    ['bytes=99999999999999999999-', 'starts past the end'],
    ['bytes=-0', 'empty'],
    ['bytes=-', 'one byte range'],
    ['bytes=0-1,5-6', 'One byte range at a time'],
    ['items=0-5', 'one byte range'],
    ['bytes=a-b', 'one byte range'],
    ['bytes= 0-5', 'one byte range'],
    ['', 'one byte range'],
  ])('refuses %j with a sentence', (header, words) => {
    const ask = parseByteRange(header, 10000)
    expect(ask.kind).toBe('refused')
    expect(ask.kind === 'refused' && ask.reason).toContain(words)
  })

  it('has no range of an empty object', () => {
    expect(parseByteRange('bytes=0-0', 0).kind).toBe('refused')
    expect(parseByteRange('bytes=-1', 0).kind).toBe('refused')
  })
})
