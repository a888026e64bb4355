import { describe, expect, it } from 'vitest'
import { freeFreeBetaL, freeFreeMode, thinningMap, thinningSensitivity } from '../../../../shared/bench/freeFreeBeam'

// source: mode shapes of the free–free Euler–Bernoulli beam, standard vibration handbooks
// (e.g. Blevins, Formulas for Natural Frequency and Mode Shape, table 8-1): βL = 4.7300, 7.8532, 10.9956;
// W(x) = cosh βx + cos βx − σ (sinh βx + sin βx), σ = (cosh βL − cos βL) / (sinh βL − sin βL).
const HANDBOOK_BETA_L = [4.7300, 7.8532, 10.9956]

/** Curvature² and W² along the bar from the handbook formula alone, independent of the module. */
function handbookSensitivity(betaL: number, n = 2001) {
  const sigma = (Math.cosh(betaL) - Math.cos(betaL)) / (Math.sinh(betaL) - Math.sin(betaL))
  const k: number[] = []
  const w: number[] = []
  for (let i = 0; i < n; i++) {
    const x = (betaL * i) / (n - 1)
    k.push((Math.cosh(x) - Math.cos(x) - sigma * (Math.sinh(x) - Math.sin(x))) ** 2)
    w.push((Math.cosh(x) + Math.cos(x) - sigma * (Math.sinh(x) + Math.sin(x))) ** 2)
  }
  const K = k.reduce((a, b) => a + b, 0)
  const M = w.reduce((a, b) => a + b, 0)
  // Rayleigh quotient, first order: removing thickness δh lowers EI by 3δh/h and ρA by δh/h.
  return { k, s: k.map((ki, i) => -(3 * ki / K - w[i]! / M)) }
}

const argmax = (xs: number[], to = xs.length) => xs.slice(0, to).reduce((best, v, i, a) => (v > a[best]! ? i : best), 0)

describe('free–free beam modes', () => {
  it('finds the handbook roots of cos βL cosh βL = 1', () => {
    HANDBOOK_BETA_L.forEach((b, i) => expect(freeFreeBetaL(i + 1)).toBeCloseTo(b, 3))
  })

  it('has the handbook node positions of the fundamental mode', () => {
    // source: Blevins table 8-1, nodes of the first free–free mode at 0.224 L and 0.776 L
    const { shape } = freeFreeMode(1)
    expect(Math.abs(shape(0.2242))).toBeLessThan(0.01)
    expect(Math.abs(shape(0.7758))).toBeLessThan(0.01)
  })

  it('fundamental: curvature² peaks at the centre; thinning there lowers most, in the outer ~15 % it raises', () => {
    const { k, s } = handbookSensitivity(HANDBOOK_BETA_L[0]!)
    const n = k.length
    expect(argmax(k, (n + 1) / 2) / (n - 1)).toBeCloseTo(0.5, 2)
    const ours = thinningMap(1)
    expect(ours.lowersMostAt[0]).toBeCloseTo(0.5, 2)
    // Sign change of the handbook sensitivity: where thinning stops raising the fundamental.
    const change = s.findIndex(v => v < 0) / (n - 1)
    expect(change).toBeGreaterThan(0.13)
    expect(change).toBeLessThan(0.16) // "about the outer 15 %"
    expect(ours.raisesWithin[0]![0]).toBe(0)
    expect(ours.raisesWithin[0]![1]).toBeCloseTo(change, 2)
  })

  it('second mode: thinning lowers it most at about 0.28 L from each end and not at all at the centre', () => {
    const { k, s } = handbookSensitivity(HANDBOOK_BETA_L[1]!)
    const n = k.length
    const half = (n - 1) / 2
    // The curvature² of the antisymmetric second mode vanishes at the centre.
    expect(k[half]! / Math.max(...k)).toBeLessThan(1e-9)
    expect(Math.abs(s[half]!)).toBeLessThan(1e-9)
    const deepest = s.slice(0, half + 1).reduce((best, v, i, a) => (v < a[best]! ? i : best), 0) / (n - 1)
    expect(deepest).toBeGreaterThan(0.27)
    expect(deepest).toBeLessThan(0.29)
    const ours = thinningMap(2)
    expect(ours.lowersMostAt[0]).toBeCloseTo(deepest, 2)
    expect(Math.abs(ours.atCentre)).toBeLessThan(1e-6)
  })

  it('is symmetric about the centre', () => {
    const s = thinningSensitivity(2, 1001)
    for (let i = 0; i < 500; i += 37) expect(s[i]).toBeCloseTo(s[1000 - i]!, 6)
  })
})
