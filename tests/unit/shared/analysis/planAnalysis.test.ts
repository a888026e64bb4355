import { describe, expect, it } from 'vitest'
import { MAIN_LOBE_BINS } from '../../../../shared/analysis/chooseWindow'
import { planAnalysis } from '../../../../shared/analysis/planAnalysis'
import { foundStrike } from '../../../support/foundStrike'

const sampleRate = 48000
const { signal: x, strike } = foundStrike([
  { frequencyHz: 200, amplitudeDb: -6, decayDbPerS: 5 },
  { frequencyHz: 800, amplitudeDb: -14, decayDbPerS: 20 },
], { sampleRate, durationS: 3, onsetS: 0.05, noiseDb: -80, seed: 6 })

describe('planAnalysis', () => {
  it('resolves the lowest partial from DC in the long window, with shorter windows above it', () => {
    const plan = planAnalysis(x, sampleRate, strike, null, undefined)
    expect(plan.needs.windowFrom).toBe('rough-pass')
    // A whole main lobe (8 bins, Harris 1978) between 200 Hz and its mirror image, with a margin
    // (25 % of the rough pass's reading of the lowest peak, less the rounding of the window to samples).
    expect(MAIN_LOBE_BINS / plan.bands[0]!.windowS).toBeLessThan(200 / 1.2)
    for (let i = 1; i < plan.bands.length; i++) expect(plan.bands[i]!.windowS).toBeLessThan(plan.bands[i - 1]!.windowS)
    expect(plan.range).toEqual({ minHz: 20, maxHz: 20000 })
  }, 60_000)

  it('keeps a forced window and adds no faster band', () => {
    const plan = planAnalysis(x, sampleRate, strike, [200, 800], 0.2)
    expect(plan.needs.windowFrom).toBe('option')
    expect(plan.bands).toHaveLength(1)
    expect(plan.bands[0]!.windowS).toBeCloseTo(0.2, 4)
  }, 60_000)
})
