import { describe, expect, it } from 'vitest'
import { basebandLevels } from '../../../../shared/analysis/basebandLevels'
import { blackmanHarris } from '../../../../shared/analysis/blackmanHarris'
import { seededRandom } from '../../../support/seededRandom'

/** |Σ x[n] e^{−2πifn/fs}|² in dB, summed directly (the DTFT's definition). */
function directLevelDb(x: Float64Array, sampleRate: number, frequencyHz: number): number {
  let re = 0
  let im = 0
  for (let n = 0; n < x.length; n++) {
    const angle = (2 * Math.PI * frequencyHz * n) / sampleRate
    re += x[n]! * Math.cos(angle)
    im -= x[n]! * Math.sin(angle)
  }
  return 10 * Math.log10(re * re + im * im + 1e-300)
}

describe('basebandLevels', () => {
  const sampleRate = 48000
  const n = 24000
  const w = blackmanHarris(n)
  const random = seededRandom(14)
  const x = Float64Array.from({ length: n }, (_, i) =>
    w[i]! * (0.5 * Math.cos((2 * Math.PI * 1003.3 * i) / sampleRate + 0.2) + 0.1 * Math.cos((2 * Math.PI * 996.1 * i) / sampleRate) + 1e-3 * random.normal()))
  // The windowed span as a real band at the input's rate (what the track gets where no decimated band serves).
  const band = { re: x, im: new Float64Array(n), sampleRateHz: sampleRate, centerHz: 0, real: true }

  it('equals the direct DTFT on its grid within the half width', () => {
    const centreHz = 1000
    const gridHz = 0.5
    const levels = basebandLevels(band, centreHz, 10, gridHz)
    expect(levels.length).toBe(2 * 20 + 1)
    const peak = Math.max(...levels)
    for (let j = -20; j <= 20; j++) {
      const direct = directLevelDb(x, sampleRate, centreHz + j * gridHz)
      // Down to 60 dB under the peak the two agree to 0.1 dB (the boxcar's aliasing; the
      // engine's amplitude goal is 0.2 dB), and to 0.01 dB on the strong partial's main lobe.
      const error = Math.abs(levels[j + 20]! - direct)
      if (direct > peak - 60) expect(error).toBeLessThan(0.1)
      if (direct > peak - 10) expect(error).toBeLessThan(0.01)
    }
  })

  it('peaks at the stronger partial', () => {
    const levels = basebandLevels(band, 1000, 10, 0.1)
    const best = levels.indexOf(Math.max(...levels))
    expect(1000 + (best - 100) * 0.1).toBeCloseTo(1003.3, 0)
  })

  it('refuses a width or grid that is not positive', () => {
    expect(() => basebandLevels(band, 1000, 0, 1)).toThrow(RangeError)
    expect(() => basebandLevels(band, 1000, 10, 0)).toThrow(RangeError)
  })
})
