import { describe, expect, it } from 'vitest'
import { analyzeStrike } from '../../../../shared/analysis/index'
import { quantisationRangeDb } from '../../../../shared/analysis/quantisationRangeDb'
import { CONDITION_CASES } from '../../../support/recordingConditions'

describe('quantisationRangeDb', () => {
  it('is the full-scale sine SQNR, 6.02·N + 1.76 dB, less 10 dB', () => {
    // source: the SQNR formula (Bennett 1948): 8 bits 49.92 dB, 16 bits 98.08 dB.
    expect(quantisationRangeDb(8)).toBeCloseTo(39.92, 2)
    expect(quantisationRangeDb(16)).toBeCloseTo(88.08, 2)
    expect(() => quantisationRangeDb(0)).toThrow(RangeError)
  })

  it('an 8-bit WAV reports its tuned partials and not the lines of its own quantisation error', async () => {
    const c = CONDITION_CASES.find(k => k.id === 'format pcm8')!
    const eight = await analyzeStrike(c.bytes())
    // Before the limit: 21 partials, 18 of them quantisation lines from −48 to −79 dB.
    expect(eight.partials.map(p => Math.round(p.frequencyHz))).toEqual(c.truthHz.map(Math.round))
    expect(eight.parameters.dynamicRangeDb).toBe(40)
    const sixteen = await analyzeStrike(CONDITION_CASES.find(k => k.id === 'format pcm16')!.bytes())
    expect(sixteen.parameters.dynamicRangeDb).toBe(80)
    expect(sixteen.warnings.some(w => w.includes('-bit audio'))).toBe(false)
  }, 60_000)
})
