import { describe, expect, it } from 'vitest'
import { chooseWindow, MAIN_LOBE_BINS, spanNeededS } from '../../../../shared/analysis/chooseWindow'

describe('chooseWindow', () => {
  it('uses the Blackman–Harris main lobe width', () => {
    expect(MAIN_LOBE_BINS).toBe(8) // source: Harris (1978), minimum 4-term Blackman–Harris, nulls at ±4 bins
  })

  it('makes the main lobe narrower than the closest spacing and the lowest partial', () => {
    for (const [spacingHz, lowestHz] of [[20, 100], [60, 40], [200, 300]] as const) {
      const choice = chooseWindow({ spacingHz, lowestHz, spanS: 4 }, 48000)
      // source: Harris (1978), main lobe 8 / T Hz wide for a window of T s
      expect(MAIN_LOBE_BINS / choice.windowS).toBeLessThanOrEqual(Math.min(spacingHz, lowestHz) + 1e-9)
    }
  })

  it('keeps the window within its bounds and the frames within about a hundred', () => {
    const wide = chooseWindow({ spacingHz: 1000, lowestHz: 1000, spanS: 6 }, 44100)
    expect(wide.windowS).toBeCloseTo(0.06, 3) // span / 100 over the 30 ms floor
    const close = chooseWindow({ spacingHz: 2, lowestHz: 100, spanS: 6 }, 44100)
    expect(close.windowS).toBeCloseTo(0.5, 3)
    const short = chooseWindow({ spacingHz: 2, lowestHz: 100, spanS: 0.6 }, 44100)
    expect(short.windowS).toBeCloseTo(0.2, 3) // a third of the span
    for (const c of [wide, close, short]) expect(c.hop).toBeLessThanOrEqual(c.windowLength)
    expect(6 / wide.hopS).toBeLessThanOrEqual(101)
  })

  it('zero-pads a window under 0.25 s to a power of two at least twice it, hop a quarter window', () => {
    const c = chooseWindow({ spacingHz: 60, lowestHz: 200, spanS: 10 }, 96000)
    expect(c.windowS).toBeLessThan(0.25)
    expect(Math.log2(c.fftSize) % 1).toBe(0)
    expect(c.fftSize).toBeGreaterThanOrEqual(2 * c.windowLength)
    expect(c.fftSize).toBeLessThan(4 * c.windowLength)
    expect(c.zeroPad).toBe(c.fftSize / c.windowLength)
    expect(c.hop).toBe(Math.round(Math.max(c.windowLength / 4, (10 * 96000) / 100)))
  })

  it('zero-pads a window of 0.25 s or more as the other bands are (at least 1.25 times)', () => {
    // A 0.5 s window at 48 kHz is 24 000 samples: 32 768 points (1.37 times), not 65 536.
    const half = chooseWindow({ spacingHz: 2, lowestHz: 100, spanS: 4 }, 48000)
    expect(half.windowLength).toBe(24000)
    expect(half.fftSize).toBe(32768)
    // At 0.25 s exactly (12 000 samples at 48 kHz): 16 384 points, where twice the window would take 32 768.
    const quarter = chooseWindow({ spacingHz: 2, lowestHz: 100, spanS: 4, windowS: 0.25 }, 48000)
    expect(quarter.fftSize).toBe(16384)
    // Just under it, twice the window: 11 952 samples → 32 768 points.
    const under = chooseWindow({ spacingHz: 2, lowestHz: 100, spanS: 4, windowS: 0.249 }, 48000)
    expect(under.fftSize).toBe(32768)
    for (const c of [half, quarter, under]) expect(c.zeroPad).toBeGreaterThanOrEqual(1.25)
  })

  it('takes a forced length and refuses a bad rate or span', () => {
    expect(chooseWindow({ spacingHz: 5, lowestHz: 50, spanS: 3, windowS: 0.1 }, 48000).windowLength).toBe(4800)
    expect(() => chooseWindow({ spacingHz: 5, lowestHz: 50, spanS: 0 }, 48000)).toThrow(RangeError)
    expect(() => chooseWindow({ spacingHz: 5, lowestHz: 50, spanS: 1 }, 0)).toThrow(RangeError)
  })

  it('names the span after which the longest window resolves a low partial from 0 Hz', () => {
    // source: Harris (1978), Blackman–Harris main lobe 8 bins = 8 / T Hz; with the 25 % margin a
    // 61 Hz partial needs T = 10 / 61 = 0.164 s, and that window is a third of the span: 0.492 s.
    expect(spanNeededS(61)).toBeCloseTo(30 / 61, 12)
    const enough = chooseWindow({ spacingHz: 1000, lowestHz: 61, spanS: spanNeededS(61) }, 48000)
    expect(enough.windowS).toBeCloseTo(10 / 61, 4)
    const short = chooseWindow({ spacingHz: 1000, lowestHz: 61, spanS: 0.9 * spanNeededS(61) }, 48000)
    expect(short.windowS).toBeLessThan(0.95 * (10 / 61))
    expect(() => spanNeededS(0)).toThrow(RangeError)
  })
})
