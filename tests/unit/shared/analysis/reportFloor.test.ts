import { describe, expect, it } from 'vitest'
import type { PhysicalBounds } from '../../../../shared/analysis/guardPartials'
import type { TrackMeasurement } from '../../../../shared/analysis/measureTrack'
import { reportFloor } from '../../../../shared/analysis/reportFloor'

function reading(fields: Partial<TrackMeasurement>): TrackMeasurement {
  return {
    frequencyHz: 440, amplitudeDb: -20, decayDbPerS: 10, t60S: 6, r2: 0.99, startS: 0.1, endS: 2, stabilityCents: 0.1,
    beatHz: null, snrDb: 60, frames: 50, modulationHz: null, modulationDepthDb: null,
    refineSpanS: 1.9, windowS: 0.1, strongestFrameDb: -22, modulationFrom: null, ...fields,
  }
}

describe('reportFloor', () => {
  const bounds: PhysicalBounds = { peakDb: -6, peakMarginDb: 1, sampleRate: 48000, minFrequencyHz: 20, maxDecayDbPerS: 6000, maxGrowthDbPerS: 1 }

  it('knows no floor before the first reading', () => {
    expect(reportFloor(bounds, 80).levelDb()).toBe(-Infinity)
  })

  it('is the strongest reading so far minus the reported range, and never falls', () => {
    const floor = reportFloor(bounds, 80)
    floor.note([reading({ amplitudeDb: -30 }), reading({ frequencyHz: 900, amplitudeDb: -24 })])
    expect(floor.levelDb()).toBe(-104)
    floor.note([reading({ frequencyHz: 1300, amplitudeDb: -50 })])
    expect(floor.levelDb()).toBe(-104)
    floor.note([reading({ frequencyHz: 1700, amplitudeDb: -12 })])
    expect(floor.levelDb()).toBe(-92)
  })

  it('counts only readings the physical bounds keep (as the reported range does)', () => {
    const floor = reportFloor(bounds, 35)
    floor.note([
      reading({ amplitudeDb: 40, strongestFrameDb: 30 }), // over the file's peak, frame too: left out
      reading({ frequencyHz: 600, amplitudeDb: -8, decayDbPerS: -5 }), // growing: left out
      reading({ frequencyHz: 700, amplitudeDb: -25 }),
    ])
    expect(floor.levelDb()).toBe(-60)
  })

  it('takes an onset level drawn back past the peak at its strongest frame, as guardPartials reports it', () => {
    const floor = reportFloor(bounds, 80)
    floor.note([reading({ amplitudeDb: 3, strongestFrameDb: -14 })])
    expect(floor.levelDb()).toBe(-94)
  })
})
