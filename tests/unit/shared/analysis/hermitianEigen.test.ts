import { EigenvalueDecomposition, Matrix } from 'ml-matrix'
import { describe, expect, it } from 'vitest'
import { hermitianEigen } from '../../../../shared/analysis/hermitianEigen'

/** A seeded random Hermitian matrix (lower triangle filled, upper left for the function to ignore). */
function randomHermitian(n: number, seed: number) {
  let s = seed
  const rnd = () => {
    s = (s * 1103515245 + 12345) % 2147483648
    return s / 2147483648 - 0.5
  }
  const re = new Float64Array(n * n)
  const im = new Float64Array(n * n)
  for (let i = 0; i < n; i++) {
    for (let j = 0; j <= i; j++) {
      re[i * n + j] = rnd()
      im[i * n + j] = i === j ? 0 : rnd()
      re[j * n + i] = 99 // not read
    }
  }
  return { re, im }
}

describe('hermitianEigen', () => {
  it('agrees with a general-purpose library on the real 2n × 2n embedding, whose eigenvalues are each twice', () => {
    for (const [n, seed] of [[5, 1], [17, 2], [21, 3]] as const) {
      const { re, im } = randomHermitian(n, seed)
      const embedding = Array.from({ length: 2 * n }, () => new Array<number>(2 * n).fill(0))
      for (let i = 0; i < n; i++) {
        for (let j = 0; j < n; j++) {
          const [ar, ai] = j <= i ? [re[i * n + j]!, im[i * n + j]!] : [re[j * n + i]!, -im[j * n + i]!]
          embedding[i]![j] = ar
          embedding[n + i]![n + j] = ar
          embedding[n + i]![j] = ai
          embedding[i]![n + j] = -ai
        }
      }
      // source: ml-matrix EigenvalueDecomposition (symmetric: Householder + QL, JAMA port) on φ(A) = [[Re A, −Im A], [Im A, Re A]]
      const reference = new EigenvalueDecomposition(new Matrix(embedding), { assumeSymmetric: true }).realEigenvalues
      const { values } = hermitianEigen(re, im, n)
      for (let k = 0; k < n; k++) expect(values[k]).toBeCloseTo(reference[2 * k]!, 12)
    }
  })

  it('gives orthonormal eigenvectors with A·v = λ·v', () => {
    const n = 17
    const { re, im } = randomHermitian(n, 7)
    const { values, vectorsRe, vectorsIm } = hermitianEigen(re, im, n)
    const a = (i: number, j: number): [number, number] => (j <= i ? [re[i * n + j]!, im[i * n + j]!] : [re[j * n + i]!, -im[j * n + i]!])
    let worst = 0
    for (let c = 0; c < n; c++) {
      for (let i = 0; i < n; i++) {
        let sr = 0
        let si = 0
        for (let j = 0; j < n; j++) {
          const [ar, ai] = a(i, j)
          sr += ar * vectorsRe[j * n + c]! - ai * vectorsIm[j * n + c]!
          si += ar * vectorsIm[j * n + c]! + ai * vectorsRe[j * n + c]!
        }
        // source: definition of an eigenpair, A v = λ v
        worst = Math.max(worst, Math.abs(sr - values[c]! * vectorsRe[i * n + c]!), Math.abs(si - values[c]! * vectorsIm[i * n + c]!))
      }
      for (let d = 0; d < n; d++) {
        let gr = 0
        let gi = 0
        for (let i = 0; i < n; i++) {
          gr += vectorsRe[i * n + c]! * vectorsRe[i * n + d]! + vectorsIm[i * n + c]! * vectorsIm[i * n + d]!
          gi += vectorsRe[i * n + c]! * vectorsIm[i * n + d]! - vectorsIm[i * n + c]! * vectorsRe[i * n + d]!
        }
        // source: a Hermitian matrix has an orthonormal eigenbasis (spectral theorem), VᴴV = I
        worst = Math.max(worst, Math.abs(gr - (c === d ? 1 : 0)), Math.abs(gi))
      }
    }
    expect(worst).toBeLessThan(1e-12)
  })

  it('handles a matrix that is already diagonal or tridiagonal, and refuses wrong sizes', () => {
    const re = Float64Array.from([2, 0, 0, 1, 3, 0, 0, 0, 1])
    const im = Float64Array.from([0, 0, 0, 1, 0, 0, 0, 0, 0])
    // source: arithmetic — the 2 × 2 block [[2, 1 − i], [1 + i, 3]] has λ = (5 ± √(1 + 8))/2 = 1 and 4; the third is 1
    expect(Array.from(hermitianEigen(re, im, 3).values).map(v => Number(v.toFixed(12)))).toEqual([1, 1, 4])
    expect(() => hermitianEigen(new Float64Array(4), new Float64Array(4), 3)).toThrow(RangeError)
  })
})
