import { describe, expect, it } from 'vitest'
import { applyTemplate } from '../../../../shared/analysis/applyTemplate'
import { expectedPartials } from '../../../../shared/analysis/expectedPartials'
import type { AnalysisResult } from '../../../../shared/analysis/types'
import { measuredPartial } from '../../../support/partials'

const partial = (frequencyHz: number) => measuredPartial({ frequencyHz })

describe('applyTemplate', () => {
  const { target, template } = expectedPartials({ targetHz: 400, ratios: [1, 3, 60] })
  // The ×60 partial (24 kHz) lies above what 44.1 kHz can hold; ×3 is missing.
  const partials = [partial(400 * 2 ** (3 / 1200))]
  const base: AnalysisResult = {
    engineVersion: '2.0.0', sampleRate: 44100, channels: 1, durationS: 2, onsetS: 0.1, analysisStartS: 0.105, analysisEndS: 2,
    fundamentalHz: null, partials, verdict: null, guidance: [], warnings: ['from an earlier step'], parameters: {} as AnalysisResult['parameters'],
  }

  it('returns a new result with the match, leaving the one it was given as it was', () => {
    const before = structuredClone(base)
    const result = applyTemplate(base, partials, target!, template!, null)
    expect(base).toEqual(before)
    expect(result).not.toBe(base)
    // source: cents = 1200 · log2(measured / target), the trade's definition (common practice)
    expect(result.matches![0]!.cents).toBeCloseTo(3, 6)
    expect(result.fundamentalHz).toBe(partials[0]!.frequencyHz)
    expect(result.verdict).not.toBeNull()
    expect(result.target).toEqual(target)
  })

  it('adds a warning per missing partial and per partial above the band, after the earlier ones', () => {
    const { warnings } = applyTemplate(base, partials, target!, template!, null)
    expect(warnings[0]).toBe('from an earlier step')
    expect(warnings.slice(1).join(' | ')).toMatch(/no partial found near 1200\.00 Hz.*\| .*24000\.00 Hz\) lies above the highest frequency/)
  })
})
