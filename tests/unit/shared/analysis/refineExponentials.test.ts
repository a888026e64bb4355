import { describe, expect, it } from 'vitest'
import { matrixPencil } from '../../../../shared/analysis/matrixPencil'
import { refineExponentials } from '../../../../shared/analysis/refineExponentials'
import { seededRandom } from '../../../support/seededRandom'

function twoExponentials(n: number, noise: number, seed: number) {
  const random = seededRandom(seed)
  const re = new Float64Array(n)
  const im = new Float64Array(n)
  for (let m = 0; m < n; m++) {
    const a = Math.exp(-0.02 * m)
    const b = 0.4 * Math.exp(-0.05 * m)
    re[m] = a * Math.cos(0.3 * m) + b * Math.cos(-0.5 * m + 1) + noise * random.normal()
    im[m] = a * Math.sin(0.3 * m) + b * Math.sin(-0.5 * m + 1) + noise * random.normal()
  }
  return { re, im }
}

describe('refineExponentials', () => {
  it('converges from a perturbed start to the exact noiseless parameters', () => {
    const signal = twoExponentials(40, 0, 1)
    const exact = matrixPencil(signal, { order: 2 })
    const start = {
      ...exact,
      frequencyCycles: exact.frequencyCycles.map(f => f + 0.002),
      dampingNepers: exact.dampingNepers.map(d => d * 1.2),
      amplitude: exact.amplitude.map(a => a * 0.9),
    }
    const refined = refineExponentials(signal, start, { iterations: 10 })
    expect(refined.frequencyCycles[0]).toBeCloseTo(-0.5 / (2 * Math.PI), 9)
    expect(refined.frequencyCycles[1]).toBeCloseTo(0.3 / (2 * Math.PI), 9)
    expect(refined.dampingNepers[0]).toBeCloseTo(0.05, 9)
    expect(refined.dampingNepers[1]).toBeCloseTo(0.02, 9)
    expect(refined.amplitude[0]).toBeCloseTo(0.4, 8)
    expect(refined.residualRms).toBeLessThan(1e-9)
  })

  it('never ends with a larger residual than the pencil it started from', () => {
    for (let seed = 1; seed <= 10; seed++) {
      const signal = twoExponentials(36, 0.05, seed)
      const pencil = matrixPencil(signal, { order: 2 })
      expect(refineExponentials(signal, pencil).residualRms).toBeLessThanOrEqual(pencil.residualRms)
    }
  })
})
