import { describe, expect, it } from 'vitest'
import {
  AnalysisError,
  AnalyzeOptionsSchema,
  analyzeSamples,
  decideVerdict,
  guidanceLines,
  matchTemplate,
  parseAnalyzeOptions,
  resolveTemplate,
  type MeasuredPartial,
  type PartialMatch,
} from '../../../../shared/analysis/index'
import { synthStrike } from '../../../support/synthStrike'

function partial(frequencyHz: number, amplitudeDb = -10): MeasuredPartial {
  return { frequencyHz, amplitudeDb, decayDbPerS: 20, t60S: 3, r2: 1, startS: 0, endS: 1, stabilityCents: 0, beatHz: null, snrDb: 60, frames: 50, modulationHz: null, modulationDepthDb: null, crossCheckCents: null, uncertaintyCents: null, uncertaintyDecayPct: null }
}

const cents = (ratio: number) => 2 ** (ratio / 1200)

describe('matchTemplate', () => {
  const template = resolveTemplate({ ratios: [1, 4, 10], tolerances: [2, 5, 8] })

  it('reports cents = 1200 log2(measured / target) and within/outside per partial', () => {
    const f0 = 261.63
    const measured = [partial(f0 * cents(1.5)), partial(4 * f0 * cents(-6)), partial(10 * f0 * cents(7.9))]
    const matches = matchTemplate(measured, template, f0)
    expect(matches.map(m => m.label)).toEqual(['fundamental', 'partial ×4', 'partial ×10'])
    expect(matches.map(m => m.cents)).toEqual([expect.closeTo(1.5, 9), expect.closeTo(-6, 9), expect.closeTo(7.9, 9)])
    expect(matches.map(m => m.within)).toEqual([true, false, true])
    expect(matches.map(m => m.direction)).toEqual(['sharp', 'flat', 'sharp'])
    expect(matches.every(m => !m.missing)).toBe(true)
    expect(matches[1]!.targetHz).toBeCloseTo(4 * f0, 9)
  })

  it('takes the strongest partial within the search window and marks missing ones', () => {
    const f0 = 200
    const measured = [partial(200 * cents(30), -30), partial(200 * cents(-20), -10), partial(800 * cents(150), -5)]
    const matches = matchTemplate(measured, template, f0)
    expect(matches[0]!.measuredHz).toBeCloseTo(200 * cents(-20), 9)
    expect(matches[1]).toMatchObject({ missing: true, within: false, measuredHz: null, cents: null })
    expect(matches[2]!.missing).toBe(true)
  })

  it('never lets two template partials claim the same measured partial', () => {
    // Membrane ratios 2.1355 and 2.2954 are 125 ¢ apart: windows shrink to 62.5 ¢ each.
    const t = resolveTemplate({ ratios: [2.1355, 2.2954], tolerances: [5], searchWindowCents: 200 })
    const between = matchTemplate([partial(100 * 2.1355 * cents(60))], t, 100)
    expect(between.map(m => m.missing)).toEqual([false, true])
    const nearer = matchTemplate([partial(100 * 2.1355 * cents(70))], t, 100)
    expect(nearer.map(m => m.missing)).toEqual([true, false])
  })

  it('normalises cents to the reference temperature', () => {
    const t = resolveTemplate({ ratios: [1], tolerances: [2], referenceTemperatureC: 20, temperatureCoefficientCentsPerC: -0.5 })
    // Warm bar at 24 °C reads 2.5 ¢ flat; at 20 °C it would read 2.5 − (−0.5 × 4) = … −0.5 ¢.
    const [m] = matchTemplate([partial(440 * cents(-2.5))], t, 440, 24) as [PartialMatch]
    expect(m.rawCents).toBeCloseTo(-2.5, 9)
    expect(m.normalizedCents).toBeCloseTo(-0.5, 9)
    expect(m.cents).toBeCloseTo(-0.5, 9)
    expect(m.within).toBe(true)
    const [raw] = matchTemplate([partial(440 * cents(-2.5))], t, 440) as [PartialMatch]
    expect(raw.normalizedCents).toBeNull()
    expect(raw.within).toBe(false)
  })
})

describe('verdict and guidance', () => {
  const match = (over: Partial<PartialMatch>): PartialMatch => ({
    label: 'fundamental', ratio: 1, targetHz: 440, measuredHz: 440, cents: 0, rawCents: 0, normalizedCents: null,
    toleranceCents: 2, within: true, missing: false, required: true, direction: 'on', amplitudeDb: -10, ...over,
  })

  it('within, outside, incomplete', () => {
    expect(decideVerdict([match({}), match({ ratio: 4 })])).toBe('within')
    expect(decideVerdict([match({}), match({ within: false, cents: 3 })])).toBe('outside')
    expect(decideVerdict([match({}), match({ missing: true, within: false, measuredHz: null, cents: null })])).toBe('incomplete')
    expect(decideVerdict([match({ within: false, cents: 9 }), match({ missing: true, within: false })])).toBe('outside')
    expect(decideVerdict([match({}), match({ within: false, cents: 30, required: false })])).toBe('within')
  })

  it('writes one plain line per partial that is outside', () => {
    const lines = guidanceLines([
      match({}),
      match({ label: 'partial ×4', ratio: 4, targetHz: 1760, measuredHz: 1765.1, cents: 5.01, within: false, toleranceCents: 3 }),
      match({ label: 'partial ×10', ratio: 10, targetHz: 4400, measuredHz: 4390, cents: -3.94, within: false, toleranceCents: 3, required: false }),
      match({ label: 'x', missing: true, within: false, measuredHz: null, cents: null }),
    ])
    expect(lines).toEqual([
      'Partial ×4 is 5.0 ¢ sharp: measured 1765.10 Hz, target 1760.00 Hz, tolerance ±3 ¢.',
      'Partial ×10 (not required) is 3.9 ¢ flat: measured 4390.00 Hz, target 4400.00 Hz, tolerance ±3 ¢.',
    ])
  })
})

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

describe('parseAnalyzeOptions', () => {
  it('turns form fields into typed options', () => {
    expect(
      parseAnalyzeOptions({
        note: 'C4', targetHz: '', referenceHz: '442', ratios: '1, 4,10', tolerances: '2,5,8', temperatureC: '24',
        labels: 'fundamental,octave,twelfth', required: 'yes,no,1', searchWindowCents: '60',
        referenceTemperatureC: '20', temperatureCoefficientCentsPerC: '-0.4',
      }),
    ).toEqual({
      note: 'C4', referenceHz: 442, ratios: [1, 4, 10], tolerances: [2, 5, 8], temperatureC: 24,
      labels: ['fundamental', 'octave', 'twelfth'], required: [true, false, true], searchWindowCents: 60,
      referenceTemperatureC: 20, temperatureCoefficientCentsPerC: -0.4,
    })
    expect(parseAnalyzeOptions({})).toEqual({})
    expect(parseAnalyzeOptions({ targetHz: '261.63' })).toEqual({ targetHz: 261.63 })
    // Other form fields (the file, a piece id) are not options and are left alone.
    expect(parseAnalyzeOptions({ note: 'A4', pieceId: '17', file: 'strike.wav' })).toEqual({ note: 'A4' })
  })

  const bad: [Record<string, string>, RegExp][] = [
    [{ note: 'H4' }, /note name/],
    [{ referenceHz: '300' }, /between 400 and 480 Hz/],
    [{ referenceHz: 'abc' }, /must be a number/],
    [{ note: 'C4', ratios: '1,x' }, /must be a number/],
    [{ note: 'C4', ratios: '1,-4' }, /greater than 0/],
    [{ note: 'C4', ratios: '1,4', tolerances: '2,5,8' }, /one tolerance per ratio/],
    [{ note: 'C4', ratios: '1,4', labels: 'a' }, /one label per ratio/],
    [{ note: 'C4', required: 'maybe' }, /yes or no/],
    [{ ratios: '1,4' }, /need a target/],
    [{ temperatureC: '500' }, /bench temperature/],
    [{ targetHz: '5' }, /between 10 and 20000 Hz/],
  ]
  for (const [fields, message] of bad) {
    it(`refuses ${JSON.stringify(fields)} with a 400 and a plain sentence`, () => {
      let caught: unknown
      try {
        parseAnalyzeOptions(fields)
      }
      catch (error) {
        caught = error
      }
      expect(caught).toBeInstanceOf(AnalysisError)
      expect((caught as AnalysisError).status).toBe(400)
      expect((caught as AnalysisError).message).toMatch(message)
      expect((caught as AnalysisError).message).toMatch(/^[A-Z"].*\.$/)
    })
  }

  it('the typed options refuse unknown keys', () => {
    expect(AnalyzeOptionsSchema.safeParse({ note: 'A4', colour: 'red' }).success).toBe(false)
    expect(() => analyzeSamples(new Float64Array(48000), 48000, { colour: 'red' } as never)).toThrow(/"colour" is not an analysis option/)
  })

  it('the schema accepts a stored template and refuses a malformed one', () => {
    const template = { partials: [{ label: 'fundamental', ratio: 1, toleranceCents: 2, required: true }] }
    expect(AnalyzeOptionsSchema.safeParse({ note: 'A4', template }).success).toBe(true)
    expect(AnalyzeOptionsSchema.safeParse({ note: 'A4', template: { partials: [] } }).success).toBe(false)
    expect(() => analyzeSamples(new Float64Array(48000), 48000, { note: 'A4', template: { partials: [] } })).toThrow(AnalysisError)
  })
})
