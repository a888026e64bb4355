import { describe, expect, it } from 'vitest'
import {
  analyzeSamples,
  parseAnalyzeOptions,
} from '../../../../shared/analysis/index'
import { synthStrike } from '../../../support/synthStrike'

// The parts of the chain have their own files (matchTemplate, resolveTemplate, decideVerdict,
// guidanceLines, parseAnalyzeOptions, analyzeOptionsSchema); this file runs them together.
const cents = (value: number) => 2 ** (value / 1200)

describe('the whole chain on a synthetic bar', () => {
  const f0 = 261.6256 // C4 at A4 = 440 Hz (source: ISO 16:1975)
  const x = synthStrike(
    [
      { frequencyHz: f0 * cents(0.8), amplitudeDb: -6, decayDbPerS: 25 },
      { frequencyHz: 4 * f0 * cents(-6.5), amplitudeDb: -20, decayDbPerS: 50 },
      { frequencyHz: 10 * f0 * cents(3), amplitudeDb: -30, decayDbPerS: 80 },
    ],
    { sampleRate: 48000, durationS: 2.5, onsetS: 0.05, noiseDb: -75, seed: 8 },
  )

  it('matches the C4 template, says outside and which partial is flat', () => {
    const result = analyzeSamples(x, 48000, { note: 'C4', ratios: [1, 4, 10], tolerances: [2, 5, 8] })
    expect(result.target).toEqual({ fundamentalHz: 261.6256, referenceHz: 440, note: 'C4' })
    expect(result.fundamentalHz).toBeCloseTo(f0 * cents(0.8), 3)
    expect(result.matches!.map(m => m.cents)).toEqual([expect.closeTo(0.8, 1), expect.closeTo(-6.5, 1), expect.closeTo(3, 1)])
    expect(result.verdict).toBe('outside')
    expect(result.guidance).toHaveLength(1)
    expect(result.guidance[0]).toMatch(/^Partial ×4 is 6\.5 ¢ flat/)
    expect(result.parameters.windowFrom).toBe('template')
  })

  it('moves every cents value with the reference pitch', () => {
    const at442 = analyzeSamples(x, 48000, { note: 'C4', referenceHz: 442, ratios: [1] })
    expect(at442.matches![0]!.cents).toBeCloseTo(0.8 - 1200 * Math.log2(442 / 440), 1)
  })

  it('normalises to the reference temperature end to end from form fields', () => {
    // A bar that reads 0.8 ¢ sharp at 26 °C; with −0.3 ¢/°C it would read 0.8 + 0.3 × 6 = 2.6 ¢ at 20 °C.
    const options = parseAnalyzeOptions({
      note: 'C4', ratios: '1', tolerances: '2', temperatureC: '26', referenceTemperatureC: '20', temperatureCoefficientCentsPerC: '-0.3',
    })
    const result = analyzeSamples(x, 48000, options)
    const m = result.matches![0]!
    expect(m.rawCents).toBeCloseTo(0.8, 1)
    expect(m.normalizedCents).toBeCloseTo(2.6, 1)
    expect(m.within).toBe(false)
    expect(result.verdict).toBe('outside')
    expect(result.temperatureC).toBe(26)
    expect(result.guidance[0]).toMatch(/^Fundamental is 2\.6 ¢ sharp/)
  })

  it('is incomplete when a required partial is missing, and accepts a stored template', () => {
    const result = analyzeSamples(x, 48000, {
      targetHz: f0,
      template: {
        partials: [
          { label: 'fundamental', ratio: 1, toleranceCents: 2, required: true },
          { label: 'second mode', ratio: 2.7565, toleranceCents: 10, required: true },
        ],
        searchWindowCents: 50,
        referenceTemperatureC: 20,
        temperatureCoefficientCentsPerC: 0,
      },
    })
    expect(result.matches!.map(m => [m.label, m.missing])).toEqual([['fundamental', false], ['second mode', true]])
    expect(result.verdict).toBe('incomplete')
    expect(result.warnings.some(w => w.includes('second mode'))).toBe(true)
  })

  it('has no target, matches or verdict without a target', () => {
    const result = analyzeSamples(x, 48000)
    expect(result.target).toBeUndefined()
    expect(result.matches).toBeUndefined()
    expect(result.verdict).toBeNull()
    expect(result.partials).toHaveLength(3)
    const json = JSON.parse(JSON.stringify(result))
    expect(Object.keys(json)).not.toContain('matches')
  })

  it('carries every field of the JSON contract', () => {
    const result = analyzeSamples(x, 48000, { note: 'C4' })
    for (const key of ['engineVersion', 'sampleRate', 'channels', 'durationS', 'onsetS', 'fundamentalHz', 'partials', 'target', 'matches', 'verdict', 'warnings', 'parameters']) {
      expect(result).toHaveProperty(key)
    }
    expect(result.engineVersion).toBe('2.0.0')
    for (const key of ['frequencyHz', 'amplitudeDb', 'decayDbPerS', 't60S', 'r2', 'startS', 'endS', 'stabilityCents', 'beatHz', 'modulationHz', 'modulationDepthDb', 'crossCheckCents', 'uncertaintyCents', 'uncertaintyDecayPct']) {
      expect(result.partials[0]).toHaveProperty(key)
    }
    for (const key of ['label', 'ratio', 'targetHz', 'measuredHz', 'cents', 'toleranceCents', 'within', 'missing']) {
      expect(result.matches![0]).toHaveProperty(key)
    }
    expect(result.parameters).toMatchObject({ window: 'blackman-harris' })
    for (const key of ['windowS', 'zeroPad', 'hopS'] as const) expect(typeof result.parameters[key]).toBe('number')
    expect(result.parameters.zeroPad).toBeGreaterThanOrEqual(2)
    const frequencies = result.partials.map(p => p.frequencyHz)
    expect(frequencies).toEqual([...frequencies].sort((a, b) => a - b))
  })
})
