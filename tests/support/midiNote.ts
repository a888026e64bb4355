/**
 * A Standard MIDI File (format 0, one track) that plays one note: program change to
 * `program` (General MIDI numbering from 0), note on at `velocity`, note off after
 * `holdS` seconds, end of track `tailS` later. Tempo 500 000 µs per quarter, 480 ticks
 * per quarter, so one tick is 1/960 s. source: MIDI 1.0 Detailed Specification, Standard MIDI Files 1.0
 */
export function midiNote(program: number, note: number, velocity: number, holdS: number, tailS: number, channel = 0): Uint8Array {
  const ticks = (s: number) => Math.max(0, Math.round(s * 960))
  const vlq = (value: number): number[] => {
    const bytes = [value & 0x7f]
    let v = value >> 7
    while (v > 0) {
      bytes.unshift((v & 0x7f) | 0x80)
      v >>= 7
    }
    return bytes
  }
  const track = [
    0x00, 0xff, 0x51, 0x03, 0x07, 0xa1, 0x20, // tempo 500 000 µs
    0x00, 0xc0 | channel, program,
    0x00, 0x90 | channel, note, velocity,
    ...vlq(ticks(holdS)), 0x80 | channel, note, 0x40,
    ...vlq(ticks(tailS)), 0xff, 0x2f, 0x00,
  ]
  const u32 = (n: number) => [(n >>> 24) & 255, (n >>> 16) & 255, (n >>> 8) & 255, n & 255]
  return Uint8Array.from([
    0x4d, 0x54, 0x68, 0x64, ...u32(6), 0x00, 0x00, 0x00, 0x01, 0x01, 0xe0,
    0x4d, 0x54, 0x72, 0x6b, ...u32(track.length), ...track,
  ])
}
