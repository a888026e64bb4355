import { describe, expect, it } from 'vitest'
import type { BandComponent } from '../../../../shared/analysis/estimateBand'
import { pencilPartial } from '../../../../shared/analysis/pencilPartial'

const component: BandComponent = { frequencyHz: 1000, decayDbPerS: 20, amplitude: 0.5, phaseRad: 0.1, frequencySdHz: 0.01, decaySdDbPerS: 0.4, snrDb: 20 }

describe('pencilPartial', () => {
  it('reports the component in the units of a measured partial', () => {
    const p = pencilPartial(component, { startS: 0.1, endS: 1.6 })
    expect(p.amplitudeDb).toBeCloseTo(-6.0206, 4) // source: 20·log10(0.5) = −6.0206 dB
    expect(p.t60S).toBeCloseTo(3, 12) // source: T60 = 60 dB / decay rate (common practice)
    expect(p.r2).toBeCloseTo(100 / 101, 12) // SNR 20 dB = 100: SNR / (SNR + 1)
    expect(p).toMatchObject({ startS: 0.1, endS: 1.6, frames: 0, crossCheckCents: null, beatHz: null, modulationHz: null })
  })

  it('turns the frequency bound into cents and the decay bound into per cent', () => {
    const p = pencilPartial(component, { startS: 0, endS: 1 })
    // source: d(cents) = 1200 / ln 2 · df / f (derivative of 1200·log2 f); 0.01 Hz at 1 kHz = 0.0173 ¢
    expect(p.stabilityCents).toBeCloseTo(0.0173123, 6)
    // With 5 % of the line's half-width: 20 dB/s is α = 2.3026 Np/s, a half-width of α/2π = 0.36647 Hz,
    // 0.63431 ¢ at 1 kHz (source: a Lorentzian line's half-width at half power, α/2π, common practice).
    expect(p.uncertaintyCents).toBeCloseTo(Math.hypot(0.0173123, 0.05 * 0.63431), 5)
    expect(p.uncertaintyDecayPct).toBeCloseTo(2, 12) // 0.4 / 20 dB/s
  })

  it('has no T60 or decay uncertainty for a partial that does not decay, and refuses a frequency of 0', () => {
    const steady = pencilPartial({ ...component, decayDbPerS: 0 }, { startS: 0, endS: 1, beatHz: 2.5, modulationHz: 5, modulationDepthDb: 1 })
    expect(steady).toMatchObject({ t60S: null, uncertaintyDecayPct: null, beatHz: 2.5, modulationHz: 5, modulationDepthDb: 1 })
    expect(() => pencilPartial({ ...component, frequencyHz: 0 }, { startS: 0, endS: 1 })).toThrow(RangeError)
  })
})
