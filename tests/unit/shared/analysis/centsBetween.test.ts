import { describe, expect, it } from 'vitest'
import { centsBetween } from '../../../../shared/analysis/centsBetween'

describe('centsBetween', () => {
  it('has exactly 100 cents per semitone and 1200 per octave', () => {
    expect(centsBetween(880, 440)).toBeCloseTo(1200, 12) // source: definition of the cent, an octave is 1200 cents
    expect(centsBetween(440, 880)).toBeCloseTo(-1200, 12)
    expect(centsBetween(440 * 2 ** (1 / 12), 440)).toBeCloseTo(100, 9) // source: 12-TET semitone = 100 cents
    expect(centsBetween(440, 440)).toBe(0)
  })

  it('gives the just fifth and major third their textbook sizes', () => {
    expect(centsBetween(3, 2)).toBeCloseTo(701.955, 3) // source: just perfect fifth 3:2 = 701.955 cents (from memory)
    expect(centsBetween(5, 4)).toBeCloseTo(386.314, 3) // source: just major third 5:4 = 386.314 cents (from memory)
  })

  it('refuses non-positive frequencies', () => {
    expect(() => centsBetween(0, 440)).toThrow(RangeError)
    expect(() => centsBetween(440, -1)).toThrow(RangeError)
    expect(() => centsBetween(Number.NaN, 440)).toThrow(RangeError)
  })
})
