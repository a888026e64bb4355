import { Matrix } from 'ml-matrix'
import { describe, expect, it } from 'vitest'
import { boundedLeastSquares } from '../../../../shared/barModel/boundedLeastSquares'

describe('boundedLeastSquares', () => {
  it('holds a variable at its bound and solves the rest for what is left', () => {
    // source: min (x₁ − 5)² + (x₂ − 1)² + (x₁ + x₂ − 6)² has x = (5, 1); with x₁ ≤ 2 it is x₂ = (1 + 4) / 2 = 2.5 (worked by hand)
    const a = new Matrix([[1, 0], [0, 1], [1, 1]])
    const x = boundedLeastSquares(a, Float64Array.of(5, 1, 6), Float64Array.of(2, 10))
    expect(x[0]).toBe(2)
    expect(x[1]).toBeCloseTo(2.5, 10)
  })

  it('gives zero to a variable whose bound is zero and to one that would go negative', () => {
    // source: worked by hand: with x₁ = 0 fixed, x₂ minimises (x₂ + 1)² → clamps at 0
    const x = boundedLeastSquares(new Matrix([[1, 0], [0, 1]]), Float64Array.of(4, -1), Float64Array.of(0, 5))
    expect(Array.from(x)).toEqual([0, 0])
  })
})
