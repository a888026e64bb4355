import { describe, expect, it } from 'vitest'
import { noteToFrequencyHz } from '../../../../shared/analysis/noteToFrequencyHz'

describe('noteToFrequencyHz', () => {
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
    // source: 12-TET, enharmonic notes share one pitch (common practice)
    expect(noteToFrequencyHz('C#4')).toBeCloseTo(noteToFrequencyHz('Db4'), 12)
    expect(noteToFrequencyHz('B#3')).toBeCloseTo(noteToFrequencyHz('C4'), 12)
    expect(noteToFrequencyHz('F♯3')).toBeCloseTo(noteToFrequencyHz('Gb3'), 12)
  })

  it('refuses bad input', () => {
    expect(() => noteToFrequencyHz('H4')).toThrow(RangeError)
    expect(() => noteToFrequencyHz('C4', 0)).toThrow(RangeError)
  })
})
