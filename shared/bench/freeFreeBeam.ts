/**
 * Bending modes of a uniform free–free Euler–Bernoulli beam, the model behind the
 * thinning guidance for bars: W(x) = cosh βx + cos βx − σ (sinh βx + sin βx), with
 * cos βL · cosh βL = 1 and σ = (cosh βL − cos βL) / (sinh βL − sin βL).
 */

/** Roots βL of cos βL · cosh βL = 1 for the first bending modes, by bisection. */
export function freeFreeBetaL(mode: number): number {
  if (!Number.isInteger(mode) || mode < 1 || mode > 8) throw new RangeError('mode must be 1…8')
  const f = (x: number) => Math.cos(x) * Math.cosh(x) - 1
  // The n-th root lies near (n + ½)π; bracket it by ±π/4.
  let lo = (mode + 0.5) * Math.PI - Math.PI / 4
  let hi = (mode + 0.5) * Math.PI + Math.PI / 4
  for (let i = 0; i < 80; i++) {
    const mid = (lo + hi) / 2
    if (Math.sign(f(mid)) === Math.sign(f(lo))) lo = mid
    else hi = mid
  }
  return (lo + hi) / 2
}

/** Mode shape W and curvature W″/β² at u = x / L (0…1) of the given mode. */
export function freeFreeMode(mode: number): { betaL: number, shape: (u: number) => number, curvature: (u: number) => number } {
  const b = freeFreeBetaL(mode)
  const sigma = (Math.cosh(b) - Math.cos(b)) / (Math.sinh(b) - Math.sin(b))
  return {
    betaL: b,
    shape: (u) => {
      const x = b * u
      return Math.cosh(x) + Math.cos(x) - sigma * (Math.sinh(x) + Math.sin(x))
    },
    curvature: (u) => {
      const x = b * u
      return Math.cosh(x) - Math.cos(x) - sigma * (Math.sinh(x) - Math.sin(x))
    },
  }
}

const SAMPLES = 1000

/**
 * First-order change of a mode's frequency when the bar is thinned a little at u = x / L,
 * from the Rayleigh quotient ω² = ∫EI W″² dx / ∫ρA W² dx of the free–free beam: a
 * relative thickness change δh/h over a short length changes EI by 3 δh/h and ρA by δh/h,
 * so δω²/ω² ∝ δh/h · (3 W″²/∫W″² − W²/∫W²). Returned per unit of removed thickness and
 * length, normalised to the largest magnitude along the bar: negative lowers the
 * frequency, positive raises it.
 */
export function thinningSensitivity(mode: number, points = SAMPLES + 1): Float64Array {
  const { shape, curvature } = freeFreeMode(mode)
  const w = new Float64Array(points)
  const k = new Float64Array(points)
  let mass = 0
  let stiffness = 0
  for (let i = 0; i < points; i++) {
    const u = i / (points - 1)
    w[i] = shape(u) ** 2
    k[i] = curvature(u) ** 2
    mass += w[i]!
    stiffness += k[i]!
  }
  const out = new Float64Array(points)
  let peak = 0
  for (let i = 0; i < points; i++) {
    // Removing material (δh < 0): stiffness lost lowers, mass lost raises.
    out[i] = -(3 * k[i]! / stiffness - w[i]! / mass)
    peak = Math.max(peak, Math.abs(out[i]!))
  }
  for (let i = 0; i < points; i++) out[i]! /= peak
  return out
}

/** Where along the bar (as fractions of its length, 0…½, mirrored at the other end) thinning moves a mode. */
export interface ThinningMap {
  mode: number
  /** Where thinning lowers the mode most. */
  lowersMostAt: number[]
  /** Stretches from the end where thinning raises the mode, e.g. [[0, 0.148]]. */
  raisesWithin: [number, number][]
  /** Value of the normalised sensitivity at the centre (0 when thinning there does nothing). */
  atCentre: number
}

export function thinningMap(mode: number): ThinningMap {
  const s = thinningSensitivity(mode)
  const half = (s.length - 1) / 2
  const u = (i: number) => i / (s.length - 1)
  let low = 0
  for (let i = 0; i <= half; i++) if (s[i]! < s[low]!) low = i
  const lowersMostAt = [u(low)]
  const raises: [number, number][] = []
  let start: number | null = null
  for (let i = 0; i <= half; i++) {
    if (s[i]! > 0 && start === null) start = i
    if ((s[i]! <= 0 || i === half) && start !== null) {
      raises.push([round3(u(start)), round3(u(s[i]! <= 0 ? i - 1 : i))])
      start = null
    }
  }
  return { mode, lowersMostAt: lowersMostAt.map(round3), raisesWithin: raises, atCentre: s[half]! }
}

function round3(x: number) {
  return Math.round(x * 1000) / 1000
}
