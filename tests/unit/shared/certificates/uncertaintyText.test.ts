import { describe, expect, it } from 'vitest'
import { matchUncertaintyCents, roundUpCents, uncertaintyFigures, uncertaintyText, type UncertaintyStrike } from '../../../../shared/certificates/uncertaintyText'

const match = (measuredHz: number | null, extra: { required?: boolean, uncertaintyCents?: number | null } = {}) =>
  ({ measuredHz, required: extra.required ?? true, missing: measuredHz === null, uncertaintyCents: extra.uncertaintyCents })

/** A strike of a 1 : 4 bar at f0 whose two partials carry the given standard uncertainties (undefined: engine 1.x, no field). */
function strike(f0: number, u: [number | undefined, number | undefined], engineVersion = '2.0.0'): UncertaintyStrike {
  return {
    engineVersion,
    matches: [match(f0), match(f0 * 4)],
    partials: [
      { frequencyHz: f0, ...(u[0] === undefined ? {} : { uncertaintyCents: u[0] }) },
      { frequencyHz: f0 * 4, ...(u[1] === undefined ? {} : { uncertaintyCents: u[1] }) },
      { frequencyHz: f0 * 9.2, uncertaintyCents: 50 }, // not tuned: never counted
    ],
  }
}

describe('roundUpCents', () => {
  it('keeps two significant figures and rounds up', () => {
    // source: JCGM 100:2008 (GUM) §7.2.6, U quoted to at most two significant digits, rounded up where appropriate
    expect(roundUpCents(0.123)).toBe('0.13')
    expect(roundUpCents(0.8)).toBe('0.80')
    expect(roundUpCents(0.3)).toBe('0.30')
    expect(roundUpCents(1.01)).toBe('1.1')
    expect(roundUpCents(12.3)).toBe('13')
    expect(roundUpCents(0.0041)).toBe('0.0041')
  })
})

describe('uncertaintyFigures', () => {
  it('expands the standard uncertainty with k = 2 and takes the largest and the median over tuned partials', () => {
    // Expanded uncertainty U = k · u with k = 2. source: JCGM 100:2008 (GUM) §6.2.1, §6.3.3
    // Median of an even count is the mean of the two middle values. common practice
    const f = uncertaintyFigures([strike(523.25, [0.1, 0.4]), strike(587.33, [0.2, 0.3])])
    expect(f.tunedPartials).toBe(4)
    expect(f.withUncertainty).toBe(4)
    expect(f.largestCents).toBeCloseTo(0.8, 12)
    expect(f.medianCents).toBeCloseTo(0.5, 12)
  })

  it('reads the uncertainty from the match when the engine put it there', () => {
    expect(matchUncertaintyCents(match(440, { uncertaintyCents: 0.25 }), [])).toBe(0.25)
    expect(matchUncertaintyCents(match(440), [{ frequencyHz: 440.0001, uncertaintyCents: 0.5 }])).toBe(0.5)
    // A partial at another frequency is not the matched one.
    expect(matchUncertaintyCents(match(440), [{ frequencyHz: 441, uncertaintyCents: 0.5 }])).toBeNull()
    expect(matchUncertaintyCents(match(null), [{ frequencyHz: 440, uncertaintyCents: 0.5 }])).toBeNull()
  })

  it('ignores reported (not required) and missing partials and unusable values', () => {
    const s = strike(440, [0.2, 0.2])
    s.matches.push(match(440 * 9.2, { required: false }), match(null))
    s.partials[1]!.uncertaintyCents = Number.NaN
    const f = uncertaintyFigures([s])
    expect(f.tunedPartials).toBe(2)
    expect(f.withUncertainty).toBe(1)
    expect(f.largestCents).toBeCloseTo(0.4, 12)
  })
})

describe('uncertaintyText', () => {
  it('states the typical and largest expanded uncertainty, the coverage and how many strikes it rests on', () => {
    const text = uncertaintyText([strike(523.25, [0.1, 0.4]), strike(587.33, [0.2, 0.3])])
    expect(text).toContain('2 strikes, one for each piece')
    expect(text).toContain('4 tuned partials')
    expect(text).toContain('±0.50 ¢ for a typical partial')
    expect(text).toContain('±0.80 ¢ for the least certain one')
    expect(text).toContain('k = 2')
    expect(text).toContain('about 95 %')
    expect(text).not.toMatch(/npm|--|\.ts\b|bench:analysis/)
  })

  it('says plainly when the strikes were measured by an engine without per-partial uncertainty', () => {
    const text = uncertaintyText([strike(523.25, [undefined, undefined], '1.0.0'), strike(587.33, [undefined, undefined], '1.0.0')])
    expect(text).toContain('earlier version of the measurement engine (1.0.0)')
    expect(text).toContain('no measured uncertainty is stated')
    expect(text).not.toContain('±')
    expect(text).not.toMatch(/npm/)
  })

  it('names what is missing when only some strikes carry an uncertainty', () => {
    const text = uncertaintyText([strike(523.25, [0.05, 0.05]), strike(587.33, [undefined, undefined], '1.0.0')])
    expect(text).toContain('Over the 2 tuned partials with such an estimate')
    expect(text).toContain('±0.10 ¢')
    expect(text).toContain('For the other 2 tuned partials (measured with engine 1.0.0) no estimate is available.')
  })

  it('says no figure can be stated when no tuned partial was measured', () => {
    const s = strike(440, [0.1, 0.1])
    s.matches = [match(null), match(null)]
    expect(uncertaintyText([s])).toContain('No tuned partial was measured')
  })
})
