import { describe, expect, it } from 'vitest'
import { solveBarModes } from '../../../../shared/barModel/solveBarModes'
import { betaLOf, uniformBar } from '../../../support/bars'

// source: free–free beam roots of cos βL cosh βL = 1 (Blevins, Formulas for Natural Frequency and Mode Shape, table 8-1)
const HANDBOOK_BETA_L = [4.7300, 7.8532, 10.9956, 14.1372]

describe('solveBarModes', () => {
  const bar = uniformBar(400, 50, 20, 1000, 10)

  it('gives a uniform bar\'s first four free–free modes within 0.05 %', () => {
    const modes = solveBarModes(bar, { modes: 4 })
    expect(modes.frequenciesHz).toHaveLength(4)
    HANDBOOK_BETA_L.forEach((b, i) => {
      expect(Math.abs(betaLOf(modes.frequenciesHz[i]!, bar) / b - 1)).toBeLessThan(0.0005)
    })
  })

  it('misses the fourth mode by more than 0.05 % with too few elements, so the check above can fail', () => {
    const coarse = solveBarModes(bar, { elements: 4, modes: 4 })
    expect(Math.abs(betaLOf(coarse.frequenciesHz[3]!, bar) / HANDBOOK_BETA_L[3]! - 1)).toBeGreaterThan(0.0005)
  })

  it('thinning a uniform bar evenly by δh moves every mode by exactly 1200·log2(1 − δh/h) ¢', () => {
    // source: Euler–Bernoulli f ∝ √(EI/ρA) ∝ h for a rectangular section (any beam-vibration text, e.g. Blevins table 8-1)
    const thinner = uniformBar(400, 50, 18.5, 1000, 10)
    const before = solveBarModes(bar).frequenciesHz
    const after = solveBarModes(thinner).frequenciesHz
    const expected = 1200 * Math.log2(1 - 1.5 / 20)
    before.forEach((f, i) => expect(1200 * Math.log2(after[i]! / f)).toBeCloseTo(expected, 6))
  })

  it('returns mass-normalised shapes with the modes\' own symmetry', () => {
    const modes = solveBarModes(bar, { modes: 2 })
    const first = modes.shapes[0]!
    const second = modes.shapes[1]!
    const n = modes.nodesM.length
    // Deflections at the two ends: equal for the symmetric first mode, opposite for the second.
    expect(first[0]!).toBeCloseTo(first[2 * (n - 1)]!, 6)
    expect(second[0]!).toBeCloseTo(-second[2 * (n - 1)]!, 6)
  })

  it('with shear and rotary inertia matches the thick-bar correction of ASTM E1876 for t/L = 0.05', () => {
    // source: ASTM E1876, flexural correction factor T1 (Goens), from memory:
    // T1 = 1 + 6.585(1 + 0.0752ν + 0.8109ν²)(t/L)² − 0.868(t/L)⁴ − 8.340(1 + 0.2023ν + 2.173ν²)(t/L)⁴ / (1 + 6.338(1 + 0.1408ν + 1.536ν²)(t/L)²)
    const nu = 0.3
    const r = 20 / 400
    const t1 = 1 + 6.585 * (1 + 0.0752 * nu + 0.8109 * nu * nu) * r * r - 0.868 * r ** 4
      - 8.340 * (1 + 0.2023 * nu + 2.173 * nu * nu) * r ** 4 / (1 + 6.338 * (1 + 0.1408 * nu + 1.536 * nu * nu) * r * r)
    const eb = solveBarModes(bar, { modes: 1 }).frequenciesHz[0]!
    const timoshenko = solveBarModes(bar, { modes: 1, theory: 'timoshenko', shearModulusGPa: 10 / (2 * (1 + nu)) }).frequenciesHz[0]!
    expect(Math.abs(timoshenko / eb - 1 / Math.sqrt(t1))).toBeLessThan(0.001)
    expect(timoshenko).toBeLessThan(eb * 0.995)
  })

  it('refuses a profile that does not span the bar', () => {
    expect(() => solveBarModes({ ...bar, profile: [{ xMm: 0, thicknessMm: 20 }, { xMm: 300, thicknessMm: 20 }] })).toThrow(/profile/)
  })
})
