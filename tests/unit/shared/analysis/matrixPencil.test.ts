import { describe, expect, it } from 'vitest'
import { matrixPencil } from '../../../../shared/analysis/matrixPencil'
import { seededRandom } from '../../../support/seededRandom'

interface Exp { amplitude: number, frequency: number, damping: number, phase: number }

function exponentials(n: number, parts: Exp[], noise = 0, seed = 1) {
  const random = seededRandom(seed)
  const re = new Float64Array(n)
  const im = new Float64Array(n)
  for (let m = 0; m < n; m++) {
    for (const p of parts) {
      const mag = p.amplitude * Math.exp(-p.damping * m)
      re[m]! += mag * Math.cos(2 * Math.PI * p.frequency * m + p.phase)
      im[m]! += mag * Math.sin(2 * Math.PI * p.frequency * m + p.phase)
    }
    re[m]! += noise * random.normal()
    im[m]! += noise * random.normal()
  }
  return { re, im }
}

const parts: Exp[] = [
  { amplitude: 0.5, frequency: -0.11, damping: 0.03, phase: -1 },
  { amplitude: 1, frequency: 0.05, damping: 0.01, phase: 0.3 },
  { amplitude: 0.2, frequency: 0.2, damping: 0, phase: 2 },
]

describe('matrixPencil', () => {
  it('recovers noiseless damped exponentials exactly (frequency, damping, amplitude, phase)', () => {
    const fit = matrixPencil(exponentials(40, parts), { order: 3 })
    parts.forEach((p, k) => {
      expect(fit.frequencyCycles[k]).toBeCloseTo(p.frequency, 10)
      expect(fit.dampingNepers[k]).toBeCloseTo(p.damping, 10)
      expect(fit.amplitude[k]).toBeCloseTo(p.amplitude, 9)
      expect(fit.phaseRad[k]).toBeCloseTo(p.phase, 9)
    })
    expect(fit.residualRms).toBeLessThan(1e-10)
  })

  it('chooses the order by MDL in white noise and keeps the singular values largest first', () => {
    const fit = matrixPencil(exponentials(60, parts, 1e-3, 5), { maxOrder: 8 })
    expect(fit.frequencyCycles.length).toBe(3)
    for (let k = 1; k < fit.singularValues.length; k++) expect(fit.singularValues[k]).toBeLessThanOrEqual(fit.singularValues[k - 1]! * (1 + 1e-12))
    parts.forEach((p, k) => expect(Math.abs(fit.frequencyCycles[k]! - p.frequency)).toBeLessThan(1e-3))
  })

  it('tells z from its mirror z̄ (negative and positive frequencies of equal damping)', () => {
    const mirror: Exp[] = [
      { amplitude: 1, frequency: -0.07, damping: 0.02, phase: 0 },
      { amplitude: 0.3, frequency: 0.07, damping: 0.02, phase: 1 },
    ]
    const fit = matrixPencil(exponentials(30, mirror), { order: 2 })
    expect(fit.frequencyCycles[0]).toBeCloseTo(-0.07, 10)
    expect(fit.amplitude[0]).toBeCloseTo(1, 9)
    expect(fit.frequencyCycles[1]).toBeCloseTo(0.07, 10)
    expect(fit.amplitude[1]).toBeCloseTo(0.3, 9)
  })

  it('refuses too few samples or an impossible order', () => {
    expect(() => matrixPencil(exponentials(5, parts))).toThrow(RangeError)
    expect(() => matrixPencil(exponentials(30, parts), { order: 20 })).toThrow(RangeError)
    expect(() => matrixPencil({ re: new Float64Array(10), im: new Float64Array(9) })).toThrow(RangeError)
  })
})
