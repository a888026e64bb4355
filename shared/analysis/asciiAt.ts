/** `length` bytes from `offset` read as Latin-1 characters (a chunk id, a four-character code). */
export function asciiAt(bytes: Uint8Array, offset: number, length: number): string {
  let s = ''
  for (let i = 0; i < length; i++) s += String.fromCharCode(bytes[offset + i]!)
  return s
}
