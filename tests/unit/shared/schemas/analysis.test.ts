import { describe, expect, it } from 'vitest'
import { analyzeSamples } from '../../../../shared/analysis/analyzeSamples'
import { synthStrike } from '../../../../shared/synthesis/synthStrike'
import { AnalysisResultSchema, parseStoredAnalysis, StoredMatchesSchema } from '../../../../shared/schemas/analysis'

// A4 = 440 Hz (ISO 16:1975); a 1 : 4 bar, both partials on target.
function storedResult() {
  const sampleRate = 48000
  const samples = synthStrike([
    { frequencyHz: 440, amplitudeDb: -10, decayDbPerS: 12 },
    { frequencyHz: 1760, amplitudeDb: -18, decayDbPerS: 20 },
  ], { sampleRate, durationS: 1.5, onsetS: 0.05, noiseDb: -80, seed: 3 })
  const result = analyzeSamples(samples, sampleRate, { targetHz: 440, ratios: [1, 4], tolerances: [5, 10] })
  // As a jsonb column gives it back.
  return JSON.parse(JSON.stringify(result)) as Record<string, any>
}

describe('stored analysis schema', () => {
  it('reads a current result back unchanged: the schema knows every field the engine writes', () => {
    const stored = storedResult()
    expect(stored.matches).toHaveLength(2)
    expect(AnalysisResultSchema.parse(stored)).toEqual(stored)
  })

  it('reads an engine 1 result with the later fields as null or empty', () => {
    const stored = storedResult()
    for (const p of stored.partials) {
      delete p.crossCheckCents
      delete p.uncertaintyCents
      delete p.uncertaintyDecayPct
      delete p.modulationHz
      delete p.modulationDepthDb
    }
    delete stored.parameters.bands
    delete stored.parameters.dynamicRangeDb
    const read = parseStoredAnalysis(stored)
    expect(read.partials[0]!.crossCheckCents).toBeNull()
    expect(read.partials[0]!.uncertaintyCents).toBeNull()
    expect(read.partials[0]!.modulationHz).toBeNull()
    expect(read.parameters.bands).toEqual([])
    expect(read.parameters.dynamicRangeDb).toBeNull()
    expect(read.partials[0]!.frequencyHz).toBe(stored.partials[0].frequencyHz)
  })

  it('refuses what is not an analysis in a sentence naming the field', () => {
    expect(() => parseStoredAnalysis({ engineVersion: '2.0.0' })).toThrow(/stored analysis cannot be read: \w+/)
    expect(() => parseStoredAnalysis(null)).toThrow(/cannot be read/)
  })

  it('reads listed matches, and an unreadable list as none', () => {
    const stored = storedResult()
    expect(StoredMatchesSchema.parse(stored.matches)).toEqual(stored.matches)
    expect(StoredMatchesSchema.parse(null)).toBeNull()
    expect(StoredMatchesSchema.parse([{ label: 'f1' }])).toBeNull()
  })
})
