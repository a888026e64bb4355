import { describe, expect, it } from 'vitest'
import { frequencyToNote } from '../../../../shared/analysis/frequencyToNote'
import { noteToFrequencyHz } from '../../../../shared/analysis/noteToFrequencyHz'

describe('frequencyToNote', () => {
  it('finds the nearest note and the deviation', () => {
    expect(frequencyToNote(440)).toMatchObject({ note: 'A4', midi: 69, cents: 0 }) // source: ISO 16:1975, MIDI 1.0 (A4 = 69)
    const sharp = frequencyToNote(261.626 * 2 ** (7 / 1200)) // source: ISO 16:1975 with 12-TET, C4 = 261.626 Hz
    expect(sharp.note).toBe('C4')
    expect(sharp.cents).toBeCloseTo(7, 2)
    expect(frequencyToNote(27.5).note).toBe('A0') // source: ISO 16:1975, A0 = 27.5 Hz
    expect(frequencyToNote(442, 442).cents).toBeCloseTo(0, 12)
  })

  it('keeps the deviation within half a semitone', () => {
    for (let f = 100; f < 200; f += 0.37) {
      const near = frequencyToNote(f)
      expect(Math.abs(near.cents)).toBeLessThanOrEqual(50 + 1e-9) // source: 12-TET, notes 100 cents apart
      expect(1200 * Math.log2(f / near.noteHz)).toBeCloseTo(near.cents, 9)
    }
  })

  it('round-trips with noteToFrequencyHz over the range of tuned percussion', () => {
    for (let midi = 24; midi <= 108; midi++) {
      const f = 440 * 2 ** ((midi - 69) / 12)
      const near = frequencyToNote(f)
      expect(near.midi).toBe(midi)
      expect(noteToFrequencyHz(near.note)).toBeCloseTo(f, 9)
    }
  })

  it('refuses non-positive frequencies', () => {
    expect(() => frequencyToNote(0)).toThrow(RangeError)
    expect(() => frequencyToNote(440, 0)).toThrow(RangeError)
  })
})
