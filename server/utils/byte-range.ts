import type { ByteRange } from './storage'

/** What a request's Range header asks of an object of a known size. */
export type RangeAsk
  = | { kind: 'whole' }
    | { kind: 'range', range: ByteRange }
    | { kind: 'refused', reason: string }

const SINGLE = /^bytes=(\d*)-(\d*)$/

/** Digits as a number; more than 15 digits is past any object we keep (Infinity). */
const count = (digits: string) => (digits.length > 15 ? Number.POSITIVE_INFINITY : Number(digits))

/**
 * One byte range of RFC 9110 §14.1.2 (`bytes=first-last`, `bytes=first-`, `bytes=-suffix`),
 * clamped to the object's size. Several ranges, other units, a range that ends before
 * it starts or starts past the end are refused (the route answers 416).
 */
export function parseByteRange(header: string | undefined, size: number): RangeAsk {
  if (header === undefined) return { kind: 'whole' }
  const text = header.trim()
  if (text.includes(',')) return { kind: 'refused', reason: 'One byte range at a time, please (bytes=first-last).' }
  const match = SINGLE.exec(text)
  if (!match || (match[1] === '' && match[2] === '')) return { kind: 'refused', reason: 'The Range header must be one byte range such as bytes=0-1023.' }
  const [, first = '', last = ''] = match
  if (first === '') {
    const suffix = count(last)
    if (suffix === 0 || size === 0) return { kind: 'refused', reason: 'That byte range is empty.' }
    return { kind: 'range', range: { start: Math.max(0, size - suffix), end: size - 1 } }
  }
  const start = count(first)
  const end = last === '' ? size - 1 : count(last)
  if (start >= size) return { kind: 'refused', reason: `That byte range starts past the end of the recording (${size} bytes).` }
  if (end < start) return { kind: 'refused', reason: 'That byte range ends before it starts.' }
  return { kind: 'range', range: { start, end: Math.min(end, size - 1) } }
}
