import { describe, expect, it } from 'vitest'
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

  it('matches a fast reading to the nearest slow partial and merges bands in turn', () => {
    const slow = [trackReading({ frequencyHz: 400, windowS: 0.4 }), trackReading({ frequencyHz: 440, windowS: 0.4 })]
    const mid = [trackReading({ frequencyHz: 436, windowS: 0.1, decayDbPerS: 80 })]
    const fast = [trackReading({ frequencyHz: 5000, windowS: 0.025 })]
    const merged = mergeBands([slow, mid, fast], maxDropPerWindowDb)
    expect(merged.map(p => p.frequencyHz)).toEqual([400, 436, 5000])
    expect(mergeBands([], maxDropPerWindowDb)).toEqual([])
  })
})
