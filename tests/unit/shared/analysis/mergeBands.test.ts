import { describe, expect, it } from 'vitest'
import type { TrackMeasurement } from '../../../../shared/analysis/measureTrack'
import { mergeBands } from '../../../../shared/analysis/mergeBands'

function partial(fields: Partial<TrackMeasurement>): TrackMeasurement {
  return {
    frequencyHz: 440, amplitudeDb: -20, decayDbPerS: 10, t60S: 6, r2: 0.99, startS: 0.1, endS: 2, stabilityCents: 0.1,
    beatHz: null, snrDb: 60, frames: 50, modulationHz: null, modulationDepthDb: null,
    refineSpanS: 1.9, windowS: 0.1, strongestFrameDb: -22, modulationFrom: null, ...fields,
  }
}

describe('mergeBands', () => {
  // A freepats steel drum B3: the long band (0.3 s) holds the 248 Hz fundamental only; the
  // 75 ms band splits it from a fast-dying ring 47.7 Hz under it, inside its half main lobe
  // (8 bins / 2 / 0.075 s = 53 Hz), so the ring is no partial that band resolves.
  const slow = [partial({ frequencyHz: 248.03, amplitudeDb: -25.7, decayDbPerS: 30, windowS: 0.299 })]
  const low = partial({ frequencyHz: 200.5, amplitudeDb: -39.7, decayDbPerS: 39, windowS: 0.075 })
  const fundamental = partial({ frequencyHz: 248.25, amplitudeDb: -28.6, decayDbPerS: 23, windowS: 0.075 })

  it('lets only the nearest faster partial replace a slower reading, in either order', () => {
    for (const fast of [[low, fundamental], [fundamental, low]]) {
      // 23 dB/s × 0.299 s = 6.9 dB > 6 dB: the fast reading of the fundamental replaces the slow one;
      // the ring (39 dB/s, also over 6 dB) is not the fundamental and stays inside its lobe.
      expect(mergeBands([slow, fast], 6).map(p => p.frequencyHz)).toEqual([248.25])
    }
  })

  it('keeps the slower reading when its nearest faster partial barely falls within a slow window', () => {
    const settled = partial({ frequencyHz: 248.2, decayDbPerS: 2, windowS: 0.075 })
    // 2 dB/s × 0.299 s = 0.6 dB: the slow reading stands, whatever a weaker neighbour does.
    expect(mergeBands([slow, [low, settled]], 6).map(p => p.frequencyHz)).toEqual([248.03])
  })

  it('adds a faster partial outside the half lobe of every slower one', () => {
    const apart = partial({ frequencyHz: 320, decayDbPerS: 80, windowS: 0.075 }) // 72 Hz > 53 Hz away
    expect(mergeBands([slow, [fundamental, apart]], 6).map(p => p.frequencyHz)).toEqual([248.25, 320])
  })
})
