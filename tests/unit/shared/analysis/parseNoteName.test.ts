import { describe, expect, it } from 'vitest'
import { parseNoteName } from '../../../../shared/analysis/parseNoteName'

describe('parseNoteName', () => {
  it('parses letters, accidentals and octaves', () => {
    expect(parseNoteName('A4')).toEqual({ letter: 'A', accidental: 0, octave: 4, midi: 69 }) // source: MIDI 1.0 spec, A4 = note 69
    expect(parseNoteName('c4')?.midi).toBe(60) // source: MIDI 1.0 spec, middle C = note 60
    expect(parseNoteName('Bb2')?.midi).toBe(46) // source: MIDI 1.0 note numbering, 12 per octave from C-1 = 0
    expect(parseNoteName('C-1')?.midi).toBe(0) // source: MIDI 1.0 spec, note 0 = C-1
    expect(parseNoteName('G9')?.midi).toBe(127) // source: MIDI 1.0 spec, note 127 = G9
    expect(parseNoteName(' F##3 ')?.midi).toBe(55)
    expect(parseNoteName('A♭5')).toEqual({ letter: 'A', accidental: -1, octave: 5, midi: 80 })
  })

  it('changes octave number between B and C', () => {
    // source: scientific pitch notation (ASA), B3 is a semitone below C4
    expect(parseNoteName('C4')!.midi - parseNoteName('B3')!.midi).toBe(1)
    expect(parseNoteName('Cb4')!.midi).toBe(parseNoteName('B3')!.midi)
  })

  it('returns null for text that is not a note', () => {
    for (const bad of ['', 'C', '4', 'H2', 'C#', 'C4.5', 'C11', 'Cb', 'C-2']) expect(parseNoteName(bad)).toBeNull()
  })
})
