import { describe, expect, it } from 'vitest'
import { dropSidebands } from '../../../../shared/analysis/dropSidebands'
import type { TrackMeasurement } from '../../../../shared/analysis/measureTrack'

function partial(fields: Partial<TrackMeasurement>): TrackMeasurement {
  return {
    frequencyHz: 440, amplitudeDb: -20, decayDbPerS: 10, t60S: 6, r2: 0.99, startS: 0.1, endS: 2, stabilityCents: 0.1,
    beatHz: null, snrDb: 60, frames: 50, modulationHz: null, modulationDepthDb: null,
    refineSpanS: 1.9, windowS: 0.1, strongestFrameDb: -22, modulationFrom: null, ...fields,
  }
}

describe('dropSidebands', () => {
  it('leaves out the k·f_m sidebands of a vibrato (modulation theorem)', () => {
    // A freepats glockenspiel G5 vibrato: sidebands 6.75 Hz apart (tests/fixtures/real/README.md).
    const carrier = partial({ frequencyHz: 784, amplitudeDb: -30, modulationHz: 6.75, modulationFrom: 'sidebands' })
    const kept = dropSidebands([carrier, partial({ frequencyHz: 784 + 2 * 6.75, amplitudeDb: -50 }), partial({ frequencyHz: 2124, amplitudeDb: -50 })])
    expect(kept.map(p => p.frequencyHz)).toEqual([784, 2124])
  })

  it('takes no rate faster than a tremolo or a sample loop for a modulation', () => {
    // A 25 ms band reads two peaks inside one main lobe 155 Hz apart: no modulation of a partial,
    // so a real partial 4 × 155 Hz away (a tabla stroke's 838 Hz beside 1455 Hz) stays.
    const fast = partial({ frequencyHz: 1455, amplitudeDb: -5, modulationHz: 155.2, modulationFrom: 'sidebands' })
    const other = partial({ frequencyHz: 1455 - 4 * 155.2, amplitudeDb: -17 })
    expect(dropSidebands([fast, other])).toHaveLength(2)
  })
})
