import { describe, expect, it } from 'vitest'
import { detectBeat } from '../../../../shared/analysis/detectBeat'
import { seededRandom } from '../../../support/seededRandom'

const settings = { minRmsDb: 0.5, minShare: 0.5 }

/** Frame times and the dB envelope of two partials `beatHz` apart, amplitudes 1 and `ratio` (mean removed). */
function beatingEnvelope(beatHz: number, ratio: number, frames: number, hopS: number) {
  const times = Float64Array.from({ length: frames }, (_, i) => 0.1 + i * hopS)
  // source: |1 + r·e^{i2πΔf t}| is periodic at Δf, the beat of two close partials (common practice)
  const envelope = times.map(t => 20 * Math.log10(Math.hypot(1 + ratio * Math.cos(2 * Math.PI * beatHz * t), ratio * Math.sin(2 * Math.PI * beatHz * t))))
  const mean = envelope.reduce((a, b) => a + b, 0) / frames
  return { times, residuals: envelope.map(v => v - mean) }
}

describe('detectBeat', () => {
  it('finds the frequency difference of two close partials', () => {
    for (const beatHz of [1.3, 3, 7.7]) {
      const { times, residuals } = beatingEnvelope(beatHz, 0.5, 200, 0.01)
      expect(Math.abs(detectBeat(times, residuals, settings)! - beatHz)).toBeLessThan(0.05)
    }
  })

  it('still finds it with frames missing', () => {
    const { times, residuals } = beatingEnvelope(2.5, 0.4, 300, 0.01)
    const keep = [...times.keys()].filter(i => i % 7 !== 3)
    expect(Math.abs(detectBeat(keep.map(i => times[i]!), keep.map(i => residuals[i]!), settings)! - 2.5)).toBeLessThan(0.05)
  })

  it('sees no beat in a flat envelope, in seeded white noise, or in too few frames', () => {
    const times = Float64Array.from({ length: 200 }, (_, i) => i * 0.01)
    expect(detectBeat(times, new Float64Array(200).fill(0.1), settings)).toBeNull()
    const random = seededRandom(9)
    // source: white noise spreads its variance over every rate, so no one rate carries half of it (common practice)
    expect(detectBeat(times, times.map(() => random.normal()), settings)).toBeNull()
    const short = beatingEnvelope(3, 0.5, 7, 0.01)
    expect(detectBeat(short.times, short.residuals, settings)).toBeNull()
  })
})
