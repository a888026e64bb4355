import { describe, expect, it } from 'vitest'
import { blackmanHarris } from '../../../../shared/analysis/blackmanHarris'
import { ENGINE_SETTINGS } from '../../../../shared/analysis/engineSettings'
import type { Baseband } from '../../../../shared/analysis/decimateBand'
import { measureModulation } from '../../../../shared/analysis/measureModulation'
import { seededRandom } from '../../../support/seededRandom'

const sampleRate = 8000

/** A windowed span of A(1 + m cos 2π f_m t) cos 2π f t plus seeded noise, `seconds` long, as a real band at its own rate. */
function tremolo(index: number, rateHz: number, seconds: number, extra: (t: number) => number = () => 0): Baseband {
  const n = Math.round(seconds * sampleRate)
  return { re: tremoloSamples(index, rateHz, n, extra), im: new Float64Array(n), sampleRateHz: sampleRate, centerHz: 0, real: true }
}

function tremoloSamples(index: number, rateHz: number, n: number, extra: (t: number) => number): Float64Array {
  const w = blackmanHarris(n)
  const random = seededRandom(23)
  return Float64Array.from({ length: n }, (_, i) => {
    const t = i / sampleRate
    return w[i]! * (0.3 * (1 + index * Math.cos(2 * Math.PI * rateHz * t)) * Math.cos(2 * Math.PI * 784 * t + 0.4) + extra(t) + 1e-5 * random.normal())
  })
}

describe('measureModulation', () => {
  it('reads rate and depth of a tremolo from its two sidebands', () => {
    const found = measureModulation(tremolo(0.2, 5, 3), 784, ENGINE_SETTINGS.modulation)!
    expect(Math.abs(found.rateHz - 5)).toBeLessThan(0.1)
    // source: modulation theorem, sidebands A·m/2 at ±f_m; envelope swing 20·log10((1 + m)/(1 − m)) = 3.52 dB for m = 0.2
    expect(Math.abs(found.depthDb - 3.52)).toBeLessThan(0.3)
  })

  it('finds no modulation on a steady partial or a lone neighbour', () => {
    expect(measureModulation(tremolo(0, 5, 3), 784, ENGINE_SETTINGS.modulation)).toBeNull()
    // A second partial 5 Hz above, with no partner below: two partials, not a tremolo.
    const neighbour = tremolo(0, 5, 3, t => 0.1 * Math.cos(2 * Math.PI * 789 * t))
    expect(measureModulation(neighbour, 784, ENGINE_SETTINGS.modulation)).toBeNull()
  })

  it('does not look for rates the span cannot resolve', () => {
    // 0.5 s resolves nothing under 6 bins = 12 Hz, the top of the range looked for.
    expect(measureModulation(tremolo(0.2, 5, 0.5), 784, ENGINE_SETTINGS.modulation)).toBeNull()
  })
})
