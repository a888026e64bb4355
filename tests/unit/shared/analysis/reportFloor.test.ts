import { describe, expect, it } from 'vitest'
import type { PhysicalBounds } from '../../../../shared/analysis/guardPartials'
import { reportFloor } from '../../../../shared/analysis/reportFloor'
import { trackReading } from '../../../support/partials'

describe('reportFloor', () => {
  const bounds: PhysicalBounds = { peakDb: -6, peakMarginDb: 1, sampleRate: 48000, minFrequencyHz: 20, spanS: 4, maxDecayDbPerS: 6000, maxGrowthDbPerS: 1 }

  it('knows no floor before the first reading', () => {
    expect(reportFloor(bounds, 80).levelDb()).toBe(-Infinity)
  })

  it('is the strongest reading so far minus the reported range, and never falls', () => {
    const floor = reportFloor(bounds, 80)
    floor.note([trackReading({ amplitudeDb: -30 }), trackReading({ frequencyHz: 900, amplitudeDb: -24 })])
    expect(floor.levelDb()).toBe(-104)
    floor.note([trackReading({ frequencyHz: 1300, amplitudeDb: -50 })])
    expect(floor.levelDb()).toBe(-104)
    floor.note([trackReading({ frequencyHz: 1700, amplitudeDb: -12 })])
    expect(floor.levelDb()).toBe(-92)
  })

  it('counts only readings the physical bounds keep (as the reported range does)', () => {
    const floor = reportFloor(bounds, 35)
    floor.note([
      trackReading({ amplitudeDb: 40, strongestFrameDb: 30 }), // over the file's peak, frame too: left out
      trackReading({ frequencyHz: 600, amplitudeDb: -8, decayDbPerS: -5 }), // growing: left out
      trackReading({ frequencyHz: 700, amplitudeDb: -25 }),
    ])
    expect(floor.levelDb()).toBe(-60)
  })

  it('takes an onset level drawn back past the peak at its strongest frame, as guardPartials reports it', () => {
    const floor = reportFloor(bounds, 80)
    floor.note([trackReading({ amplitudeDb: 3, strongestFrameDb: -14 })])
    expect(floor.levelDb()).toBe(-94)
  })
})
