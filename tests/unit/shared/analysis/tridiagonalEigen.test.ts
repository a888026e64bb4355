import { describe, expect, it } from 'vitest'
import { tridiagonalEigen } from '../../../../shared/analysis/tridiagonalEigen'

const identity = (n: number) => {
  const z = new Float64Array(n * n)
  for (let i = 0; i < n; i++) z[i * n + i] = 1
  return z
}

describe('tridiagonalEigen', () => {
  it('finds the eigenvalues 2 − 2cos(kπ/(n+1)) and sine eigenvectors of the second-difference matrix', () => {
    const n = 12
    const diagonal = new Float64Array(n).fill(2)
    const offDiagonal = new Float64Array(n).fill(-1)
    const z = identity(n)
    tridiagonalEigen(diagonal, offDiagonal, z)
    for (let k = 1; k <= n; k++) {
      // source: Strang, Introduction to Applied Mathematics (1986), §1.5: eigenvalues of tridiag(−1, 2, −1) are 2 − 2cos(kπ/(n+1)), eigenvectors sin(jkπ/(n+1))
      expect(diagonal[k - 1]).toBeCloseTo(2 - 2 * Math.cos((k * Math.PI) / (n + 1)), 13)
      const norm = Math.sqrt((n + 1) / 2)
      const sign = Math.sign(z[k - 1]!) // z[0][k−1]: first component, sin(kπ/(n+1)) > 0
      for (let j = 1; j <= n; j++) expect(sign * z[(j - 1) * n + k - 1]!).toBeCloseTo(Math.sin((j * k * Math.PI) / (n + 1)) / norm, 12)
    }
  })

  it('returns a diagonal matrix\'s entries sorted, its eigenvectors the unit vectors they came from', () => {
    const diagonal = Float64Array.from([3, -1, 2])
    const z = identity(3)
    tridiagonalEigen(diagonal, new Float64Array(3), z)
    // source: arithmetic — a diagonal matrix's eigenvalues are its diagonal entries
    expect(Array.from(diagonal)).toEqual([-1, 2, 3])
    expect(Array.from(z)).toEqual([0, 0, 1, 1, 0, 0, 0, 1, 0])
  })

  it('refuses arrays of the wrong sizes', () => {
    expect(() => tridiagonalEigen(new Float64Array(3), new Float64Array(2), identity(3))).toThrow(RangeError)
    expect(() => tridiagonalEigen(new Float64Array(3), new Float64Array(3), identity(2))).toThrow(RangeError)
  })
})
