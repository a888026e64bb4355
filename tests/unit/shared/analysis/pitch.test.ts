import { describe, expect, it } from 'vitest'
import { centsBetween, frequencyToNote, noteToFrequencyHz, parseNoteName } from '../../../../shared/analysis/index'

describe('twelve-tone equal temperament', () => {
  it('gives the standard frequencies at A4 = 440 Hz', () => {
    expect(noteToFrequencyHz('A4')).toBe(440) // source: ISO 16:1975 (A4 = 440 Hz)
    expect(noteToFrequencyHz('C4')).toBeCloseTo(261.626, 3) // source: ISO 16:1975 with 12-TET, C4 = 261.626 Hz
    expect(noteToFrequencyHz('A2')).toBeCloseTo(110, 9) // source: ISO 16:1975, two octaves below A4
    expect(noteToFrequencyHz('C8')).toBeCloseTo(4186.009, 3) // source: ISO 16:1975 with 12-TET, C8 = 4186.009 Hz
    expect(noteToFrequencyHz('C2')).toBeCloseTo(65.406, 3) // source: 12-TET table, C2 = 65.406 Hz (from memory)
    expect(noteToFrequencyHz('A0')).toBeCloseTo(27.5, 9) // source: ISO 16:1975, A0 = 27.5 Hz
  })

  it('scales with the reference pitch', () => {
    expect(noteToFrequencyHz('A4', 442)).toBe(442)
    expect(noteToFrequencyHz('C4', 442) / noteToFrequencyHz('C4', 440)).toBeCloseTo(442 / 440, 12)
  })

  it('treats enharmonic spellings alike', () => {
    expect(noteToFrequencyHz('C#4')).toBeCloseTo(noteToFrequencyHz('Db4'), 12)
    expect(noteToFrequencyHz('B#3')).toBeCloseTo(noteToFrequencyHz('C4'), 12)
    expect(noteToFrequencyHz('F♯3')).toBeCloseTo(noteToFrequencyHz('Gb3'), 12)
  })

  it('has exactly 100 cents per semitone and 1200 per octave', () => {
    expect(centsBetween(noteToFrequencyHz('C#4'), noteToFrequencyHz('C4'))).toBeCloseTo(100, 9)
    expect(centsBetween(880, 440)).toBeCloseTo(1200, 12)
    expect(centsBetween(440, 880)).toBeCloseTo(-1200, 12)
    expect(centsBetween(440, 440)).toBe(0)
  })

  it('refuses bad input', () => {
    expect(() => noteToFrequencyHz('H4')).toThrow(RangeError)
    expect(() => noteToFrequencyHz('C4', 0)).toThrow(RangeError)
    expect(() => centsBetween(0, 440)).toThrow(RangeError)
  })
})

describe('parseNoteName', () => {
  it('parses letters, accidentals and octaves', () => {
    expect(parseNoteName('A4')).toEqual({ letter: 'A', accidental: 0, octave: 4, midi: 69 }) // source: MIDI 1.0 spec, A4 = note 69
    expect(parseNoteName('c4')?.midi).toBe(60) // source: MIDI 1.0 spec, middle C = note 60
    expect(parseNoteName('Bb2')?.midi).toBe(46)
    expect(parseNoteName('C-1')?.midi).toBe(0)
    expect(parseNoteName(' F##3 ')?.midi).toBe(55)
  })

  it('returns null for text that is not a note', () => {
    for (const bad of ['', 'C', '4', 'H2', 'C#', 'C4.5', 'C11', 'Cb']) expect(parseNoteName(bad)).toBeNull()
  })
})

describe('frequencyToNote', () => {
  it('finds the nearest note and the deviation', () => {
    expect(frequencyToNote(440)).toMatchObject({ note: 'A4', midi: 69, cents: 0 })
    const sharp = frequencyToNote(261.626 * 2 ** (7 / 1200))
    expect(sharp.note).toBe('C4')
    expect(sharp.cents).toBeCloseTo(7, 2)
    expect(frequencyToNote(27.5).note).toBe('A0')
    expect(frequencyToNote(442, 442).cents).toBeCloseTo(0, 12)
  })

  it('round-trips with noteToFrequencyHz over the range of tuned percussion', () => {
    for (let midi = 24; midi <= 108; midi++) {
      const f = 440 * 2 ** ((midi - 69) / 12)
      const near = frequencyToNote(f)
      expect(near.midi).toBe(midi)
      expect(noteToFrequencyHz(near.note)).toBeCloseTo(f, 9)
    }
  })
})
