import { describe, expect, it } from 'vitest'
import { AnalysisError } from '../../../../shared/analysis/AnalysisError'
import { parseAnalyzeOptions } from '../../../../shared/analysis/parseAnalyzeOptions'

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
})
