import { describe, expect, it } from 'vitest'
import { analyzeSamples, chooseWindow, MAIN_LOBE_BINS } from '../../../../shared/analysis/index'
import { dropSidebands } from '../../../../shared/analysis/dropSidebands'
import { guardPartials, type PhysicalBounds } from '../../../../shared/analysis/guardPartials'
import { measureModulation } from '../../../../shared/analysis/measureModulation'
import { mergeBands } from '../../../../shared/analysis/mergeBands'
import { planBands } from '../../../../shared/analysis/planBands'
import { blackmanHarris } from '../../../../shared/analysis/blackmanHarris'
import { synthRealisticStrike, tremoloDepthDb } from '../../../../shared/synthesis/synthRealisticStrike'
import { synthStrike } from '../../../support/synthStrike'
import { trackReading } from '../../../support/partials'

const settings = { shortestWindowS: 0.008, bandWindowRatio: 4, fastBandFrames: 100 }

describe('planBands (multi-resolution layout)', () => {
  const long = chooseWindow({ spacingHz: 50, lowestHz: 100, spanS: 3 }, 48000)
  const bands = planBands(long, [[100, 150, 400, 1200, 3600]], 48000, { startIndex: 0, endIndex: 144000 }, { minHz: 20, maxHz: 20000 }, settings)

  it('starts with the long window over the whole band and shortens by 4 down to 8 ms', () => {
    expect(bands[0]!.windowS).toBe(long.windowS)
    expect(bands[0]!.fromHz).toBe(20)
    for (let i = 1; i < bands.length; i++) {
      expect(bands[i]!.windowS).toBeCloseTo(Math.max(0.008, bands[i - 1]!.windowS / 4), 4)
      expect(bands[i]!.hop).toBe(Math.round(bands[i]!.windowLength / 4))
    }
    expect(bands[bands.length - 1]!.windowS).toBeCloseTo(0.008, 4)
  })

  it('gives each fast band only frequencies it resolves from DC and from close neighbours', () => {
    for (const band of bands.slice(1)) {
      // 1.25 main lobes from DC: a whole lobe between the partial and its mirror image at −f.
      expect(band.ownFromHz).toBeGreaterThanOrEqual((1.25 * MAIN_LOBE_BINS) / band.windowS - 1e-9)
      // 100 and 150 Hz are 50 Hz apart: no fast window resolves them, so each fast band
      // holds them inside a pair zone, where it may only add what the slower bands missed.
      expect(band.pairZonesHz.some(([lo, hi]) => lo <= 100 && hi >= 150)).toBe(true)
      expect(band.endIndex).toBeLessThanOrEqual(band.hop * 100 + band.windowLength)
    }
  })

  it('counts neighbours 6 main-lobe bins or more apart as resolved (a xylophone\'s ×3 and ×6 in the 8 ms window)', () => {
    // source: Harris 1978 — a Blackman–Harris main lobe is 8 bins wide (±4) and its sidelobes 92 dB down,
    // so two peaks 6 bins apart each lie, with the bins beside them, outside the other's main lobe.
    const shortest = (list: number[]) => planBands(long, [list], 48000, { startIndex: 0, endIndex: 144000 }, { minHz: 20, maxHz: 20000 }, settings).at(-1)!
    const binHz = 1 / shortest([]).windowS
    expect(shortest([1047.7, 2095.4]).pairZonesHz).toEqual([]) // 8.4 bins apart
    expect(shortest([1047.7, 1047.7 + 6.2 * binHz]).pairZonesHz).toEqual([])
    expect(shortest([1047.7, 1047.7 + 5.8 * binHz]).pairZonesHz).toHaveLength(1)
  })

  it('adds no fast band under a forced window (none shorter is wanted)', () => {
    expect(planBands(long, [], 48000, { startIndex: 0, endIndex: 144000 }, { minHz: 20, maxHz: 20000 }, { ...settings, shortestWindowS: Infinity })).toHaveLength(1)
  })
})

describe('mergeBands', () => {
  it('adds what only a fast band saw and lets it replace a reading its slow window smeared', () => {
    const slow = [trackReading({ frequencyHz: 500, windowS: 0.2, decayDbPerS: 5 }), trackReading({ frequencyHz: 1500, windowS: 0.2, decayDbPerS: 60 })]
    const fast = [trackReading({ frequencyHz: 500.1, windowS: 0.05, decayDbPerS: 5.1 }), trackReading({ frequencyHz: 1500.2, windowS: 0.05, decayDbPerS: 200, endS: 0.3 }), trackReading({ frequencyHz: 3000, windowS: 0.05 })]
    const merged = mergeBands([slow, fast], 6)
    // 5 dB/s × 0.2 s = 1 dB: the slow reading stands; 200 dB/s × 0.2 s = 40 dB: the fast one wins.
    expect(merged.map(p => [p.frequencyHz, p.windowS])).toEqual([[500, 0.2], [1500.2, 0.05], [3000, 0.05]])
  })

  it('never lets a far weaker fast-dying line in a strong partial\'s skirt take its place', () => {
    // A marimba bar at 1012.4 Hz (−11 dB, 7 dB/s) in a room: the 0.125 s band sees no more of it
    // than a line 32 Hz above, 53 dB under it and dying at 56 dB/s (56 × 0.5 s = 28 dB > 6 dB).
    const slow = [trackReading({ frequencyHz: 1012.4, amplitudeDb: -11.2, windowS: 0.5, decayDbPerS: 7 })]
    const skirt = trackReading({ frequencyHz: 1044.0, amplitudeDb: -64.8, windowS: 0.125, decayDbPerS: 56.4 })
    expect(mergeBands([slow, [skirt]], 6).map(p => p.frequencyHz)).toEqual([1012.4])
    // The same partial read 10 dB louder by the faster window (its decay smeared by the slow one) still replaces it.
    const same = trackReading({ frequencyHz: 1012.5, amplitudeDb: -1.2, windowS: 0.125, decayDbPerS: 56.4, endS: 1 })
    expect(mergeBands([slow, [same]], 6).map(p => p.frequencyHz)).toEqual([1012.5])
  })

  it('never replaces a reading with one that falls further than its track could show (the guard would drop both)', () => {
    const slow = [trackReading({ frequencyHz: 1145.2, amplitudeDb: -23.1, windowS: 0.1, decayDbPerS: 376, startS: 0.04, endS: 0.17, snrDb: 40 })]
    // 2400 dB/s over 0.05 s = 120 dB, more than its 40 dB over the noise + 30 dB of slack.
    const implausible = trackReading({ frequencyHz: 1144.9, amplitudeDb: -20, windowS: 0.025, decayDbPerS: 2400, startS: 0.02, endS: 0.07, snrDb: 40 })
    expect(mergeBands([slow, [implausible]], 6).map(p => p.frequencyHz)).toEqual([1145.2])
  })
})

describe('guardPartials (physical bounds)', () => {
  const bounds: PhysicalBounds = { peakDb: -6, peakMarginDb: 1, sampleRate: 48000, minFrequencyHz: 20, spanS: 4, maxDecayDbPerS: 6000, maxGrowthDbPerS: 1 }

  it('leaves out amplitudes above the file\'s peak, growth, impossible decays and frequencies outside the band', () => {
    const { kept, warnings } = guardPartials([
      trackReading({ frequencyHz: 1870, amplitudeDb: 205, strongestFrameDb: 190 }),
      trackReading({ frequencyHz: 600, decayDbPerS: -5 }),
      trackReading({ frequencyHz: 700, decayDbPerS: 9000 }),
      trackReading({ frequencyHz: 800, decayDbPerS: 100, startS: 0.1, endS: 2, snrDb: 40 }),
      trackReading({ frequencyHz: 24000 }),
      trackReading({ frequencyHz: 25, windowS: 0.1 }),
      trackReading({ frequencyHz: 440 }),
    ], bounds)
    expect(kept.map(p => p.frequencyHz)).toEqual([440])
    expect(warnings).toHaveLength(4)
    expect(warnings.join(' ')).toMatch(/peak level.*growing.*decay faster.*frequency outside/)
  })

  it('reports a barely negative rate as 0 dB/s with no T60, and an overshooting onset amplitude at its strongest frame', () => {
    const { kept, warnings } = guardPartials([
      trackReading({ frequencyHz: 300, decayDbPerS: -0.4, t60S: null }),
      trackReading({ frequencyHz: 350, amplitudeDb: -2, strongestFrameDb: -14 }),
    ], bounds)
    expect(kept[0]).toMatchObject({ decayDbPerS: 0, t60S: null })
    expect(kept[1]!.amplitudeDb).toBe(-14)
    expect(warnings[0]).toMatch(/strongest frame/)
  })
})

describe('measureModulation', () => {
  const sampleRate = 48000
  const w = blackmanHarris(2 * sampleRate)
  const span = (x: Float64Array) => ({ re: x.slice(0, w.length).map((v, i) => v * w[i]!), im: new Float64Array(w.length), sampleRateHz: sampleRate, centerHz: 0 })
  const look = { minRateHz: 1.5, maxRateHz: 12, maxBelowCarrierDb: 30, maxImbalanceDb: 6 }

  it('reads the rate and depth of a tremolo from its two sidebands', () => {
    // 2 s of sound: bins of 0.5 Hz, so rates from 6 bins (3 Hz) up are clear of the carrier's main lobe.
    for (const [rateHz, index] of [[3.5, 0.3], [5.5, 0.5], [9, 0.8]] as const) {
      const x = synthRealisticStrike([{ frequencyHz: 440, amplitudeDb: -6, decayDbPerS: 4, tremolo: { rateHz, index } }], { sampleRate, durationS: 2.2, onsetS: 0, noiseDb: -90 })
      const m = measureModulation(span(x), 440, look)!
      expect(m.rateHz).toBeCloseTo(rateHz, 1)
      // source: modulation theorem — each sideband A·m/2; depth 20·log10((1 + m)/(1 − m))
      expect(Math.abs(m.depthDb - tremoloDepthDb(index))).toBeLessThan(0.5)
    }
  })

  it('finds none on a plain decaying partial nor on a beating pair (one neighbour, no mirror)', () => {
    const plain = synthStrike([{ frequencyHz: 440, amplitudeDb: -6, decayDbPerS: 4 }], { sampleRate, durationS: 2.2, noiseDb: -90 })
    expect(measureModulation(span(plain), 440, look)).toBeNull()
    const pair = synthStrike([{ frequencyHz: 440, amplitudeDb: -6, decayDbPerS: 4 }, { frequencyHz: 446, amplitudeDb: -12, decayDbPerS: 4 }], { sampleRate, durationS: 2.2, noiseDb: -90 })
    expect(measureModulation(span(pair), 440, look)).toBeNull()
  })
})

describe('dropSidebands', () => {
  it('leaves out weaker partials k·f_m from a carrier with sidebands, keeps an unrelated neighbour', () => {
    const carrier = trackReading({ frequencyHz: 784, amplitudeDb: -40, modulationHz: 6.75, modulationFrom: 'sidebands' })
    const kept = dropSidebands([
      carrier,
      trackReading({ frequencyHz: 790.75, amplitudeDb: -46 }),
      trackReading({ frequencyHz: 770.5, amplitudeDb: -57 }),
      trackReading({ frequencyHz: 795, amplitudeDb: -50 }),
    ])
    expect(kept.map(p => p.frequencyHz)).toEqual([784, 795])
  })
})

describe('short-lived partials', () => {
  it('measures a partial of T60 0.1 s (600 dB/s) from the first tens of milliseconds', () => {
    // source: T60 = 60 dB / decay rate (definition)
    const truth = [
      { frequencyHz: 523.25, amplitudeDb: -10, decayDbPerS: 20 },
      { frequencyHz: 3140, amplitudeDb: -16, decayDbPerS: 600 },
    ]
    const x = synthStrike(truth, { sampleRate: 48000, durationS: 2, onsetS: 0.05, noiseDb: -90, seed: 4 })
    for (const options of [{}, { targetHz: 523.25, ratios: [1, 6] }]) {
      const result = analyzeSamples(x, 48000, options)
      const fast = result.partials.find(p => Math.abs(p.frequencyHz - 3140) < 5)!
      expect(fast, JSON.stringify(options)).toBeDefined()
      expect(Math.abs(fast.decayDbPerS / 600 - 1)).toBeLessThan(0.05)
      expect(Math.abs(fast.amplitudeDb + 16)).toBeLessThan(0.5)
      expect(fast.endS).toBeLessThan(0.25)
    }
  })
})
