import { EigenvalueDecomposition, Matrix } from 'ml-matrix'
import { describe, expect, it } from 'vitest'
import { realEigenvalues } from '../../../../shared/analysis/realEigenvalues'
import { seededRandom } from '../../../support/seededRandom'

/** Q·T·Q with Q = I − 2vvᵀ/vᵀv (orthogonal and its own inverse): a matrix with T's eigenvalues. */
function similar(t: number[][], v: number[]): Float64Array {
  const n = t.length
  const vv = v.reduce((s, x) => s + x * x, 0)
  const q = Array.from({ length: n }, (_, i) => Array.from({ length: n }, (_, j) => (i === j ? 1 : 0) - (2 * v[i]! * v[j]!) / vv))
  const mul = (a: number[][], b: number[][]) => a.map(row => b[0]!.map((_, j) => row.reduce((s, x, k) => s + x * b[k]![j]!, 0)))
  return Float64Array.from(mul(mul(q, t), q).flat())
}

const sorted = (e: { re: Float64Array, im: Float64Array }) =>
  Array.from(e.re, (re, k) => [re, e.im[k]!]).sort((a, b) => a[0]! - b[0]! || a[1]! - b[1]!)

describe('realEigenvalues', () => {
  it('finds the eigenvalues of a matrix similar to a triangular one: its diagonal', () => {
    // source: similar matrices share eigenvalues; a triangular matrix's are its diagonal (common practice).
    const t = [[1, 5, -2, 0.5], [0, 2, 3, 1], [0, 0, 3, -4], [0, 0, 0, -0.5]]
    const e = realEigenvalues(similar(t, [1, -2, 0.5, 3]), 4)
    expect(sorted(e).map(([re]) => re)).toEqual([-0.5, 1, 2, 3].map(x => expect.closeTo(x, 12)))
    expect(Array.from(e.im)).toEqual([0, 0, 0, 0])
  })

  it('finds a rotation\'s conjugate pair e^{±iθ} beside a real eigenvalue', () => {
    // source: [[cos θ, −sin θ], [sin θ, cos θ]] has eigenvalues cos θ ± i·sin θ (common practice).
    const th = 0.7
    const t = [[Math.cos(th), -Math.sin(th), 2], [Math.sin(th), Math.cos(th), -1], [0, 0, 0.25]]
    const e = sorted(realEigenvalues(similar(t, [0.3, 1, -0.6]), 3))
    expect(e[0]).toEqual([expect.closeTo(0.25, 12), 0])
    expect(e[1]).toEqual([expect.closeTo(Math.cos(th), 12), expect.closeTo(-Math.sin(th), 12)])
    expect(e[2]).toEqual([expect.closeTo(Math.cos(th), 12), expect.closeTo(Math.sin(th), 12)])
  })

  it('gives exactly what ml-matrix\'s EigenvalueDecomposition gives on general matrices', () => {
    // source: ml-matrix 6.15 (a general-purpose reference library); the steps are the same, so the values are bit for bit.
    const random = seededRandom(5)
    for (let t = 0; t < 200; t++) {
      const n = 1 + (t % 10)
      const a = Array.from({ length: n }, () => Array.from({ length: n }, () => random.normal()))
      const reference = new EigenvalueDecomposition(new Matrix(a))
      const ours = realEigenvalues(Float64Array.from(a.flat()), n)
      expect(Array.from(ours.re)).toEqual(reference.realEigenvalues)
      expect(Array.from(ours.im)).toEqual(reference.imaginaryEigenvalues)
    }
  })

  it('stops, with a RangeError, on a matrix whose QR iteration does not settle', () => {
    // The pencil matrix of a vibraphone's tremolo band (4 Hz, stereo pair, hum) on which the same steps without a limit never returned.
    const stuck = [
      [-0.000025305348850985302, -0.9941072794181482, -0.0009054657428344218, 0.14081793339048138, 0.00132167736261123, 0.16874324611268798],
      [0.9941072794181478, -0.00002530534885098522, -0.14081793339048138, -0.0009054657428344223, -0.168743246112688, 0.0013216773626112267],
      [-0.0003594572865685639, -0.02219927036107285, -0.012976053682957076, -0.812347009232427, 0.005094186447622023, 0.5799106753928137],
      [0.022199270361072804, -0.00035945728656856444, 0.8123470092324269, -0.012976053682957069, -0.5799106753928135, 0.005094186447622015],
      [0.0004651016098456795, -0.0404134164752294, 0.005123944557226463, -0.4986279490155663, 0.013007974794370297, -0.8453763521806908],
      [0.04041341647522938, 0.0004651016098456765, 0.4986279490155664, 0.00512394455722646, 0.8453763521806911, 0.013007974794370308],
    ]
    expect(() => realEigenvalues(Float64Array.from(stuck.flat()), 6)).toThrow(/did not converge/)
  })

  it('needs a finite square matrix', () => {
    expect(() => realEigenvalues(new Float64Array(5), 2)).toThrow(RangeError)
    expect(() => realEigenvalues(Float64Array.from([1, Number.NaN, 0, 1]), 2)).toThrow(RangeError)
  })
})
