import { describe, expect, it } from 'vitest'
import { analyzeSamples } from '../../../../shared/analysis/analyzeSamples'
import { centsBetween } from '../../../../shared/analysis/centsBetween'
import { roundResult } from '../../../../shared/analysis/roundResult'
import type { AnalysisResult } from '../../../../shared/analysis/types'
import { measuredPartial, partialMatch } from '../../../support/partials'
import { synthStrike } from '../../../support/synthStrike'

describe('roundResult', () => {
  const measured = analyzeSamples(synthStrike([{ frequencyHz: 65.406, amplitudeDb: -10, decayDbPerS: 5 }], { sampleRate: 8000, durationS: 1, noiseDb: -80, seed: 1 }), 8000)
  const c2 = 65.40639132514966 // source: ISO 16:1975 with 12-TET, C2 = 440 · 2^(−45/12) Hz
  const raw: AnalysisResult = {
    ...measured,
    fundamentalHz: c2,
    partials: [measuredPartial({ frequencyHz: c2, amplitudeDb: -12.3456789, decayDbPerS: 5.123456, t60S: 60 / 5.123456, beatHz: null, crossCheckCents: 0.0123456 })],
    matches: [partialMatch({ targetHz: 65.4, measuredHz: c2, cents: centsBetween(c2, 65.4), rawCents: centsBetween(c2, 65.4), amplitudeDb: -12.3456789 })],
  }
  const before = structuredClone(raw)
  const rounded = roundResult(raw)

  it('keeps frequencies to well under a hundredth of a cent', () => {
    // source: 1200 · log2(1 + 0.00005 / 65.4) = 0.0013 ¢, half the last digit kept at 65 Hz
    expect(Math.abs(centsBetween(rounded.partials[0]!.frequencyHz, c2))).toBeLessThan(0.0014)
    expect(rounded.partials[0]!.frequencyHz).toBe(65.4064)
    expect(rounded.fundamentalHz).toBe(65.4064)
    expect(rounded.partials[0]!.amplitudeDb).toBe(-12.35)
    expect(rounded.partials[0]!.t60S).toBe(11.711)
    expect(rounded.matches![0]!.cents).toBe(Math.round(centsBetween(c2, 65.4) * 100) / 100)
  })

  it('rounds uncertainties up, so a small one is never stated as 0', () => {
    const small = roundResult({ ...raw, partials: [measuredPartial({ frequencyHz: c2, uncertaintyCents: 0.00012, uncertaintyDecayPct: 0.0041 }), measuredPartial({ frequencyHz: 2 * c2, uncertaintyCents: 0.25, uncertaintyDecayPct: 1.2 })] })
    // source: JCGM 100:2008 (GUM) §7.2.6, an uncertainty may be rounded up rather than to the nearest digit
    expect(small.partials.map(p => [p.uncertaintyCents, p.uncertaintyDecayPct])).toEqual([[0.001, 0.01], [0.25, 1.2]])
    expect(roundResult(small)).toEqual(small)
  })

  it('passes nulls through, changes nothing it was given, and rounds once for all', () => {
    expect(rounded.partials[0]!.beatHz).toBeNull()
    expect(raw).toEqual(before)
    expect(roundResult(rounded)).toEqual(rounded)
    expect(rounded.verdict).toBe(raw.verdict)
  })
})
