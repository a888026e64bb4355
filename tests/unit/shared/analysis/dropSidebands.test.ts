import { describe, expect, it } from 'vitest'
import { dropSidebands } from '../../../../shared/analysis/dropSidebands'
import { trackReading } from '../../../support/partials'

describe('dropSidebands', () => {
  it('leaves out the k·f_m sidebands of a vibrato (modulation theorem)', () => {
    // A freepats glockenspiel G5 vibrato: sidebands 6.75 Hz apart (tests/fixtures/real/README.md).
    const carrier = trackReading({ frequencyHz: 784, amplitudeDb: -30, modulationHz: 6.75, modulationFrom: 'sidebands' })
    const kept = dropSidebands([carrier, trackReading({ frequencyHz: 784 + 2 * 6.75, amplitudeDb: -50 }), trackReading({ frequencyHz: 2124, amplitudeDb: -50 })])
    expect(kept.map(p => p.frequencyHz)).toEqual([784, 2124])
  })

  it('takes no rate faster than a tremolo or a sample loop for a modulation', () => {
    // A 25 ms band reads two peaks inside one main lobe 155 Hz apart: no modulation of a partial,
    // so a real partial 4 × 155 Hz away (a tabla stroke's 838 Hz beside 1455 Hz) stays.
    const fast = trackReading({ frequencyHz: 1455, amplitudeDb: -5, modulationHz: 155.2, modulationFrom: 'sidebands' })
    const other = trackReading({ frequencyHz: 1455 - 4 * 155.2, amplitudeDb: -17 })
    expect(dropSidebands([fast, other])).toHaveLength(2)
  })
})
