import { describe, expect, it } from 'vitest'
import { dropDuplicates } from '../../../../shared/analysis/dropDuplicates'
import { mergeBands } from '../../../../shared/analysis/mergeBands'
import { trackReading } from '../../../support/partials'

const maxDropPerWindowDb = 6

describe('mergeBands', () => {
  it('treats a faster band\'s reading within half its main lobe as the same partial', () => {
    // source: Harris (1978), 4-term Blackman–Harris main lobe ±4 bins = ±4 / T Hz; 4 / 0.05 s = 80 Hz
    const slow = [trackReading({ frequencyHz: 1000, windowS: 0.2, decayDbPerS: 5 })]
    const inside = trackReading({ frequencyHz: 1079, windowS: 0.05, decayDbPerS: 5 })
    const outside = trackReading({ frequencyHz: 1081, windowS: 0.05, decayDbPerS: 5 })
    expect(mergeBands([slow, [inside]], maxDropPerWindowDb).map(p => p.frequencyHz)).toEqual([1000])
    expect(mergeBands([slow, [outside]], maxDropPerWindowDb).map(p => p.frequencyHz)).toEqual([1000, 1081])
  })

  it('takes the faster reading where the partial falls more than the limit within one slow window', () => {
    // 0.2 s windows: 25 dB/s falls 5 dB in one (kept), 35 dB/s falls 7 dB (replaced).
    const slowWindow = (decayDbPerS: number) => [trackReading({ frequencyHz: 700, windowS: 0.2, decayDbPerS })]
    const fast = (decayDbPerS: number) => [trackReading({ frequencyHz: 700.3, windowS: 0.05, decayDbPerS })]
    expect(mergeBands([slowWindow(25), fast(25)], maxDropPerWindowDb)[0]!.windowS).toBe(0.2)
    expect(mergeBands([slowWindow(35), fast(35)], maxDropPerWindowDb)[0]!.windowS).toBe(0.05)
  })

  it('keeps every reading of a faster band no slower one holds, however near another of its own: the longer track wins later', () => {
    // A freepats xylophone C5 with noise at −65 dB: the 30 ms band read its ×3 twice, a fast first stage
    // at 1576.8 Hz (6 frames) and the partial itself at 1584.6 Hz (24 frames, the manual reading 1585.1);
    // the first one in took the other's place, and the ×3 read 8.5 ¢ off. dropDuplicates keeps the longer track.
    const slow = [trackReading({ frequencyHz: 524, windowS: 0.12 })]
    const early = trackReading({ frequencyHz: 1576.78, windowS: 0.0303, decayDbPerS: 280, frames: 6, refineSpanS: 0.068, amplitudeDb: -32 })
    const partial = trackReading({ frequencyHz: 1584.61, windowS: 0.0303, decayDbPerS: 157, frames: 24, refineSpanS: 0.258, amplitudeDb: -39.5 })
    const merged = mergeBands([slow, [early, partial]], maxDropPerWindowDb)
    expect(merged.map(p => p.frequencyHz)).toEqual([524, 1576.78, 1584.61])
    expect(dropDuplicates(merged).map(p => p.frequencyHz)).toEqual([524, 1584.61])
  })

  it('matches a fast reading to the nearest slow partial and merges bands in turn', () => {
    const slow = [trackReading({ frequencyHz: 400, windowS: 0.4 }), trackReading({ frequencyHz: 440, windowS: 0.4 })]
    const mid = [trackReading({ frequencyHz: 436, windowS: 0.1, decayDbPerS: 80, endS: 0.6 })]
    const fast = [trackReading({ frequencyHz: 5000, windowS: 0.025 })]
    const merged = mergeBands([slow, mid, fast], maxDropPerWindowDb)
    expect(merged.map(p => p.frequencyHz)).toEqual([400, 436, 5000])
    expect(mergeBands([], maxDropPerWindowDb)).toEqual([])
  })
})

describe('mergeBands: the nearest faster partial', () => {
  // A freepats steel drum B3: the long band (0.3 s) holds the 248 Hz fundamental only; the
  // 75 ms band splits it from a fast-dying ring 47.7 Hz under it, inside its half main lobe
  // (8 bins / 2 / 0.075 s = 53 Hz), so the ring is no partial that band resolves.
  const slow = [trackReading({ frequencyHz: 248.03, amplitudeDb: -25.7, decayDbPerS: 30, windowS: 0.299 })]
  const low = trackReading({ frequencyHz: 200.5, amplitudeDb: -39.7, decayDbPerS: 39, windowS: 0.075 })
  const fundamental = trackReading({ frequencyHz: 248.25, amplitudeDb: -28.6, decayDbPerS: 23, windowS: 0.075 })

  it('lets only the nearest faster partial replace a slower reading, in either order', () => {
    for (const fast of [[low, fundamental], [fundamental, low]]) {
      // 23 dB/s × 0.299 s = 6.9 dB > 6 dB: the fast reading of the fundamental replaces the slow one;
      // the ring (39 dB/s, also over 6 dB) is not the fundamental and stays inside its lobe.
      expect(mergeBands([slow, fast], 6).map(p => p.frequencyHz)).toEqual([248.25])
    }
  })

  it('keeps the slower reading when its nearest faster partial barely falls within a slow window', () => {
    const settled = trackReading({ frequencyHz: 248.2, decayDbPerS: 2, windowS: 0.075 })
    // 2 dB/s × 0.299 s = 0.6 dB: the slow reading stands, whatever a weaker neighbour does.
    expect(mergeBands([slow, [low, settled]], 6).map(p => p.frequencyHz)).toEqual([248.03])
  })

  it('adds a faster partial outside the half lobe of every slower one', () => {
    const apart = trackReading({ frequencyHz: 320, decayDbPerS: 80, windowS: 0.075 }) // 72 Hz > 53 Hz away
    expect(mergeBands([slow, [fundamental, apart]], 6).map(p => p.frequencyHz)).toEqual([248.25, 320])
  })
})

describe('mergeBands: a faster reading far louder than the slower one', () => {
  // A xylophone ×6 (2 867.6 Hz, −25.8 dB, 556 dB/s) in a live room at 96 kHz: the 30 ms band's
  // track of it was fitted to the room's tail, −60 dB; the 8 ms band read the partial itself.
  // source: Harris (1978), Blackman–Harris half main lobe 4 bins: 4 / 0.03 s = 133 Hz, 4 / 0.008 s = 500 Hz.
  const fast = (decayDbPerS: number) => trackReading({ frequencyHz: 2865.2, amplitudeDb: -25.2, decayDbPerS, windowS: 0.008, startS: 0.1, endS: 0.17 })
  const slowAt = (frequencyHz: number) => [trackReading({ frequencyHz, amplitudeDb: -60.2, decayDbPerS: 20, windowS: 0.03 })]

  it('takes the misread reading\'s place inside the slower window\'s main lobe, smeared or not', () => {
    for (const decayDbPerS of [100, 560]) {
      const merged = mergeBands([slowAt(2858.5), [fast(decayDbPerS)]], maxDropPerWindowDb)
      expect(merged.map(p => [p.frequencyHz, p.amplitudeDb])).toEqual([[2865.2, -25.2]])
    }
  })

  it('is added beside a slower reading outside that lobe (another mode)', () => {
    const merged = mergeBands([slowAt(2600), [fast(560)]], maxDropPerWindowDb)
    expect(merged.map(p => p.frequencyHz)).toEqual([2600, 2865.2])
  })

  it('lets a faint line nearer to the slower reading stand neither for it nor in the way', () => {
    // A xylophone ×6 at 96 kHz on a spaced pair in a room: the 98 ms band read only the room's lines
    // (−72 dB); the 24.5 ms band read the ×6 (−21 dB) 0.5 Hz further from them than a faint line (−94 dB).
    const slow = [trackReading({ frequencyHz: 6064.73, amplitudeDb: -72.3, decayDbPerS: 37, windowS: 0.098 })]
    const faint = trackReading({ frequencyHz: 6072.76, amplitudeDb: -93.7, decayDbPerS: 53, windowS: 0.0245 })
    const partial = trackReading({ frequencyHz: 6073.29, amplitudeDb: -21.2, decayDbPerS: 718, windowS: 0.0245, startS: 0.527, endS: 0.558 })
    for (const fast of [[faint, partial], [partial, faint]]) {
      expect(mergeBands([slow, fast], maxDropPerWindowDb).map(p => p.frequencyHz)).toEqual([6073.29])
    }
  })
  it('takes the place of the nearest reading it misread, and the other misreadings of it go', () => {
    // A xylophone ×6 (6 457.7 Hz, −22.3 dB, 473 dB/s) at 96 kHz on a spaced pair in a room: the
    // 30 ms band read a growing faint line 9 Hz from it (−87.9 dB) and a smeared reading 48 Hz
    // under it (−66.5 dB); the 8 ms band read the ×6 beside two faint lines, one of them nearer
    // to the −66.5 dB reading. source: Harris (1978), half main lobe 4 / 0.03 s = 133 Hz.
    const slow = [
      trackReading({ frequencyHz: 6410.74, amplitudeDb: -66.5, decayDbPerS: 192.6, windowS: 0.03 }),
      trackReading({ frequencyHz: 6449.63, amplitudeDb: -87.9, decayDbPerS: -40.4, windowS: 0.03 }),
    ]
    const partial = trackReading({ frequencyHz: 6458.76, amplitudeDb: -23.7, decayDbPerS: 460.6, windowS: 0.008, startS: 0.08, endS: 0.2 })
    const faint = [
      trackReading({ frequencyHz: 6448.95, amplitudeDb: -81.6, decayDbPerS: 3.4, windowS: 0.008 }),
      trackReading({ frequencyHz: 6455.81, amplitudeDb: -70.9, decayDbPerS: 25.7, windowS: 0.008 }),
    ]
    for (const fast of [[partial, ...faint], [...faint, partial]]) {
      expect(mergeBands([slow, fast], maxDropPerWindowDb).map(p => p.frequencyHz)).toEqual([6458.76])
    }
  })
  it('does not take a line extrapolated back to the blow, far over every frame of its track, for a louder partial', () => {
    // A tubular bell C5 near 5.64 kHz: the 31 ms band split its faint track (strongest frame −77.6 dB)
    // into two lines, one of them 243.6 dB/s and −37.7 dB at the onset, 40 dB over anything the
    // track showed; the 125 ms band read −68.5 dB. The nearer line (88.7 dB/s: 11 dB within the slow
    // window) replaces the slow reading; the extrapolated one stands for nothing.
    const slow = [trackReading({ frequencyHz: 5638.5, amplitudeDb: -68.5, decayDbPerS: 92.2, strongestFrameDb: -68, windowS: 0.125 })]
    const track = { strongestFrameDb: -77.6, windowS: 0.0313, startS: 0.1, endS: 0.311 }
    const near = trackReading({ frequencyHz: 5638.83, amplitudeDb: -68.1, decayDbPerS: 88.7, ...track })
    const extrapolated = trackReading({ frequencyHz: 5656.58, amplitudeDb: -37.7, decayDbPerS: 243.6, ...track })
    for (const fast of [[near, extrapolated], [extrapolated, near]]) {
      expect(mergeBands([slow, fast], maxDropPerWindowDb).map(p => p.frequencyHz)).toEqual([5638.83])
    }
  })
})
