import { describe, expect, it } from 'vitest'
import { expandNoteRange, midiToNote, noteToMidi } from '../../../../shared/records/noteRange'

describe('note ranges', () => {
  it('numbers notes as MIDI does', () => {
    // source: MIDI 1.0 Detailed Specification — middle C (C4) = 60, A4 = 69.
    expect(noteToMidi('C4')).toBe(60)
    expect(noteToMidi('A4')).toBe(69)
    expect(noteToMidi('A2')).toBe(45)
    expect(noteToMidi('C7')).toBe(96)
    expect(noteToMidi('Bb2')).toBe(noteToMidi('A#2'))
    expect(midiToNote(61)).toBe('C#4')
    expect(midiToNote(noteToMidi('C8'))).toBe('C8')
  })

  it('expands a 4.3-octave marimba A2–C7 to 52 bars, 31 without accidentals', () => {
    // source: common practice — the 4.3-octave marimba range A2–C7 has 52 bars.
    const chromatic = expandNoteRange('A2', 'C7', true)
    expect(chromatic).toHaveLength(52)
    expect(chromatic.slice(0, 4)).toEqual(['A2', 'A#2', 'B2', 'C3'])
    // A2, B2, 28 naturals C3–B6, C7 (common practice: 7 naturals per octave).
    expect(expandNoteRange('A2', 'C7', false)).toHaveLength(31)
  })

  it('expands a 3-octave glockenspiel C5–C8 to 37 plates', () => {
    // 3 octaves × 12 semitones + 1 (common practice)
    expect(expandNoteRange('C5', 'C8', true)).toHaveLength(37)
  })

  it('refuses backwards and oversized ranges and bad note names with a sentence', () => {
    expect(() => expandNoteRange('C5', 'C4', true)).toThrow(/backwards/)
    expect(() => expandNoteRange('C0', 'C10', true, 120)).toThrow(/at most 120 pieces/)
    expect(() => expandNoteRange('H2', 'C4', true)).toThrow(/not a note name/)
  })
})
