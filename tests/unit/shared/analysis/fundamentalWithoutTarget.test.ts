import { describe, expect, it } from 'vitest'
import { fundamentalWithoutTarget } from '../../../../shared/analysis/fundamentalWithoutTarget'
import { measuredPartial } from '../../../support/partials'

describe('fundamentalWithoutTarget', () => {
  it('takes the lowest partial within 20 dB of the strongest', () => {
    // A tuned bell's weak hum an octave under the prime, and a strong nominal (common practice: hum 0.5, prime 1, nominal 2).
    const partials = [
      measuredPartial({ frequencyHz: 261.6, amplitudeDb: -38 }),
      measuredPartial({ frequencyHz: 523.3, amplitudeDb: -20 }),
      measuredPartial({ frequencyHz: 1046.5, amplitudeDb: -6 }),
    ]
    expect(fundamentalWithoutTarget(partials)?.frequencyHz).toBe(523.3)
    expect(fundamentalWithoutTarget(partials.slice(1))?.frequencyHz).toBe(523.3)
    expect(fundamentalWithoutTarget([partials[0]!, { ...partials[1]!, amplitudeDb: -27 }, partials[2]!])?.frequencyHz).toBe(1046.5)
  })

  it('counts a partial exactly 20 dB under as within', () => {
    const partials = [measuredPartial({ frequencyHz: 200, amplitudeDb: -30 }), measuredPartial({ frequencyHz: 800, amplitudeDb: -10 })]
    expect(fundamentalWithoutTarget(partials)?.frequencyHz).toBe(200)
  })

  it('has no fundamental without partials', () => {
    expect(fundamentalWithoutTarget([])).toBeUndefined()
  })
})
