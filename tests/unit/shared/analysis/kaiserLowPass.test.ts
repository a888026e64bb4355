import { describe, expect, it } from 'vitest'
import { kaiserLowPass } from '../../../../shared/analysis/kaiserLowPass'

/** |H(f)| of FIR taps at f cycles per sample. */
function gain(taps: Float64Array, f: number): number {
  let re = 0
  let im = 0
  for (let n = 0; n < taps.length; n++) {
    re += taps[n]! * Math.cos(2 * Math.PI * f * n)
    im -= taps[n]! * Math.sin(2 * Math.PI * f * n)
  }
  return Math.hypot(re, im)
}

describe('kaiserLowPass', () => {
  const cases = [
    { cutoff: 0.1, transition: 0.05, attenuationDb: 60 },
    { cutoff: 0.05, transition: 0.0375, attenuationDb: 50 },
  ]

  it('has the length of Kaiser\'s formula, odd and symmetric, with unit gain at 0 Hz', () => {
    for (const c of cases) {
      const taps = kaiserLowPass(c.cutoff, c.transition, { attenuationDb: c.attenuationDb })
      // source: Oppenheim & Schafer, Discrete-Time Signal Processing 3rd ed., eq. 7.63: M = (A − 8) / (2.285 Δω)
      const order = Math.ceil((c.attenuationDb - 8) / (2.285 * 2 * Math.PI * c.transition))
      expect(taps.length - 1).toBeGreaterThanOrEqual(order)
      expect(taps.length - 1).toBeLessThanOrEqual(order + 1)
      expect(taps.length % 2).toBe(1)
      for (let n = 0; n < taps.length; n++) expect(taps[n]).toBeCloseTo(taps[taps.length - 1 - n]!, 15)
      expect(taps.reduce((s, v) => s + v, 0)).toBeCloseTo(1, 12)
    }
  })

  it('meets the stopband attenuation and passband ripple it was designed for, and is −6 dB at the cutoff', () => {
    for (const c of cases) {
      const taps = kaiserLowPass(c.cutoff, c.transition, { attenuationDb: c.attenuationDb })
      let stop = 0
      for (let f = c.cutoff + c.transition / 2; f <= 0.5; f += 0.0002) stop = Math.max(stop, gain(taps, f))
      let ripple = 0
      for (let f = 0; f <= c.cutoff - c.transition / 2; f += 0.0002) ripple = Math.max(ripple, Math.abs(gain(taps, f) - 1))
      // source: Oppenheim & Schafer §7.6.1: Kaiser's formulas meet A to within about 1.5 dB; ripple δ = 10^(−A/20) in both bands
      expect(20 * Math.log10(stop)).toBeLessThan(-(c.attenuationDb - 1.5))
      expect(ripple).toBeLessThan(1.5 * 10 ** (-c.attenuationDb / 20))
      expect(gain(taps, c.cutoff)).toBeCloseTo(0.5, 2)
    }
  })

  it('refuses a cutoff, transition or attenuation out of range', () => {
    expect(() => kaiserLowPass(0, 0.1)).toThrow(RangeError)
    expect(() => kaiserLowPass(0.5, 0.1)).toThrow(RangeError)
    expect(() => kaiserLowPass(0.1, 0)).toThrow(RangeError)
    expect(() => kaiserLowPass(0.1, 0.1, { attenuationDb: 10 })).toThrow(RangeError)
  })
})
