import { describe, expect, it } from 'vitest'
import { dropDuplicates } from '../../../../shared/analysis/dropDuplicates'
import { trackReading } from '../../../support/partials'

describe('dropDuplicates', () => {
  it('keeps the longer of two readings closer than the long window resolves', () => {
    // source: a window of T s resolves frequencies 1 / T Hz apart (Rayleigh resolution, common practice): 0.5 Hz for 2 s
    const long = trackReading({ frequencyHz: 440, frames: 80, refineSpanS: 2 })
    const broken = trackReading({ frequencyHz: 440.3, frames: 30, refineSpanS: 2 })
    expect(dropDuplicates([broken, long])).toEqual([long])
  })

  it('keeps readings farther apart than that, in ascending frequency', () => {
    const a = trackReading({ frequencyHz: 440.6, frames: 30, refineSpanS: 2 })
    const b = trackReading({ frequencyHz: 440, frames: 80, refineSpanS: 2 })
    const c = trackReading({ frequencyHz: 200, frames: 10, refineSpanS: 0.5 })
    expect(dropDuplicates([a, b, c]).map(p => p.frequencyHz)).toEqual([200, 440, 440.6])
  })

  it('uses the shorter span of the two, and the louder reading when the lengths tie', () => {
    const short = trackReading({ frequencyHz: 1000, frames: 20, refineSpanS: 0.25 })
    const near = trackReading({ frequencyHz: 1003, frames: 40, refineSpanS: 3 })
    expect(dropDuplicates([short, near])).toEqual([near])
    const quiet = trackReading({ frequencyHz: 700, frames: 50, amplitudeDb: -40 })
    const loud = trackReading({ frequencyHz: 700.1, frames: 50, amplitudeDb: -20 })
    expect(dropDuplicates([quiet, loud])).toEqual([loud])
  })
})
