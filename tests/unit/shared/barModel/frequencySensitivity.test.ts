import { describe, expect, it } from 'vitest'
import { applyCuts } from '../../../../shared/barModel/applyCuts'
import { frequencySensitivity } from '../../../../shared/barModel/frequencySensitivity'
import { solveBarModes } from '../../../../shared/barModel/solveBarModes'
import { ROSEWOOD_LIKE, uniformBar } from '../../../support/bars'

const bar = uniformBar(380, 55, 22, ROSEWOOD_LIKE.densityKgM3, ROSEWOOD_LIKE.youngsModulusGPa)
const stations = Array.from({ length: 21 }, (_, i) => i * 19)
const meshed = { ...bar, profile: applyCuts(bar.profile, stations.map(xMm => ({ xMm, depthMm: 0 }))) }
const modes = solveBarModes(meshed)
const sensitivity = frequencySensitivity(meshed, modes, stations)

describe('frequencySensitivity', () => {
  it('lowers the fundamental when the centre is thinned and raises it when the ends are, as the Bench advises', () => {
    // source: the Bench's guidance (shared/bench/thinningAdvice.ts): "thin near the centre" to lower, "thin within the outer … at each end" to raise; common practice
    expect(sensitivity[0]![10]!).toBeLessThan(0)
    expect(sensitivity[0]![0]!).toBeGreaterThan(0)
    expect(sensitivity[0]![20]!).toBeGreaterThan(0)
  })

  it('moves the second mode least with a cut at the centre, its node', () => {
    // source: the second free–free mode is antisymmetric, with w = w″ = 0 at the centre (Blevins, table 8-1)
    const second = Array.from(sensitivity[1]!, Math.abs)
    expect(second.indexOf(Math.min(...second))).toBe(10)
    expect(second[10]!).toBeLessThan(0.05 * Math.abs(sensitivity[0]![10]!))
  })

  it('sums to −δh/h for an even thinning, every mode', () => {
    // source: Euler–Bernoulli f ∝ h for a rectangular section, so δf/f = −δh/h (Blevins, table 8-1)
    for (const row of sensitivity) expect(row.reduce((a, b) => a + b, 0)).toBeCloseTo(-1 / 22, 9)
  })

  it('predicts a small cut within 5 % of re-solving the model after it', () => {
    // source: first-order perturbation is exact in the limit of a small change (Rayleigh's principle); 5 % is the bound
    for (const j of [2, 5, 8, 10]) {
      const cut = applyCuts(bar.profile, [{ xMm: stations[j - 1]!, depthMm: 0 }, { xMm: stations[j]!, depthMm: 0.3 }, { xMm: stations[j + 1]!, depthMm: 0 }])
      const after = solveBarModes({ ...bar, profile: cut }).frequenciesHz
      modes.frequenciesHz.forEach((f, m) => {
        const actual = after[m]! / f - 1
        const predicted = sensitivity[m]![j]! * 0.3
        if (Math.abs(actual) > 1e-5) expect(Math.abs(predicted / actual - 1)).toBeLessThan(0.05)
      })
    }
  })
})
