import { describe, expect, it } from 'vitest'
import { findSecondStrike } from '../../../../shared/analysis/findSecondStrike'
import { synthRealisticStrike } from '../../../../shared/synthesis/synthRealisticStrike'

const sampleRate = 48000
const bar = [
  { frequencyHz: 523.4, amplitudeDb: -10, decayDbPerS: 40, phaseRad: 0 },
  { frequencyHz: 1572.1, amplitudeDb: -14, decayDbPerS: 200, phaseRad: 1 },
]
const blow = (onsetS: number, seed: number) => synthRealisticStrike(bar, { sampleRate, durationS: 2, onsetS, seed, mallet: { levelDb: -14, durationS: 0.002 } })
const span = { onsetIndex: Math.round(0.1 * sampleRate), fromIndex: Math.round(0.105 * sampleRate), toIndex: 2 * sampleRate }

describe('findSecondStrike', () => {
  it('finds a soft second blow with its contact noise 0.3 s after the first, to the millisecond', () => {
    const first = blow(0.1, 1)
    const second = blow(0.4, 2)
    const x = first.map((v, i) => v + 0.3 * second[i]!)
    // source: the synthesised second onset at 0.4 s; 1 ms blocks.
    const at = findSecondStrike(x, sampleRate, span)
    expect(at).not.toBeNull()
    expect(Math.abs(at! / sampleRate - 0.4)).toBeLessThanOrEqual(0.001)
  })

  it('finds nothing in one strike, nor before the search starts', () => {
    expect(findSecondStrike(blow(0.1, 1), sampleRate, span)).toBeNull()
    const first = blow(0.1, 1)
    const second = blow(0.4, 2)
    const x = first.map((v, i) => v + 0.3 * second[i]!)
    expect(findSecondStrike(x, sampleRate, { ...span, fromIndex: Math.round(0.5 * sampleRate) })).toBeNull()
  })

  it('ignores a blow far under the strike (a rattle 40 dB down)', () => {
    const first = blow(0.1, 1)
    const rattle = blow(0.4, 2)
    expect(findSecondStrike(first.map((v, i) => v + 0.01 * rattle[i]!), sampleRate, span)).toBeNull()
  })

  it('answers null for a span too short to judge', () => {
    expect(findSecondStrike(blow(0.1, 1), sampleRate, { ...span, toIndex: span.fromIndex + 100 })).toBeNull()
  })
})
