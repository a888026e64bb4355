/**
 * Offset of the first byte after a leading ID3v2 tag (0 when there is none). The tag's
 * size is four 7-bit bytes, plus a 10-byte footer when its flag is set (ID3v2.4 §3.1).
 */
export function skipId3v2(bytes: Uint8Array): number {
  if (bytes.length < 10 || bytes[0] !== 0x49 || bytes[1] !== 0x44 || bytes[2] !== 0x33) return 0
  const size = ((bytes[6]! & 0x7f) << 21) | ((bytes[7]! & 0x7f) << 14) | ((bytes[8]! & 0x7f) << 7) | (bytes[9]! & 0x7f)
  const footer = (bytes[5]! & 0x10) !== 0 ? 10 : 0
  return Math.min(bytes.length, 10 + size + footer)
}
