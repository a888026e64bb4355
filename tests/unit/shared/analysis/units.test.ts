import { describe, expect, it } from 'vitest'
import { centsBetween } from '../../../../shared/analysis/centsBetween'
import { CENTS_PER_LOG, DB_PER_NEPER, energyBlockLength } from '../../../../shared/analysis/units'

describe('units', () => {
  it('turns a natural-log frequency ratio into cents as the cent is defined', () => {
    expect(CENTS_PER_LOG * Math.log(2)).toBeCloseTo(1200, 12) // source: definition of the cent, an octave is 1200 cents
    expect(CENTS_PER_LOG * Math.log(1.5)).toBeCloseTo(centsBetween(3, 2), 12)
  })

  it('has about 8.686 dB in a neper', () => {
    expect(DB_PER_NEPER).toBeCloseTo(8.685889638, 8) // source: ISO 80000-3 / IEC 60027-3, 1 Np = 20/ln 10 dB ≈ 8.685 889 638 dB
    expect(20 * Math.log10(Math.exp(-1))).toBeCloseTo(-DB_PER_NEPER, 12)
  })

  it('makes 1 ms energy blocks, never shorter than 16 samples', () => {
    expect(energyBlockLength(48000)).toBe(48)
    expect(energyBlockLength(44100)).toBe(44)
    expect(energyBlockLength(96000)).toBe(96)
    expect(energyBlockLength(8000)).toBe(16)
    expect(energyBlockLength(48000, 0.002)).toBe(96)
  })
})
