import { GAUSS_POINTS, GAUSS_WEIGHTS } from './gaussLegendre'
import { hermiteCubic } from './hermiteCubic'
import { sectionProperties } from './sectionProperties'
import { thicknessAtMm } from './thicknessAtMm'
import type { BarGeometry, BarModes } from './types'

/**
 * Relative frequency change of each mode per millimetre of depth removed at each station,
 * δf/f per mm (negative: the mode goes down). A cut at a station tapers linearly to zero
 * at the neighbouring stations. First-order Rayleigh-quotient perturbation of a beam of
 * rectangular section, where EI ∝ h³ and ρA ∝ h:
 *   δf/f = ½ ∫ (δh/h) (3 EI w″² − ω² ρA w²) dx / ∫ EI w″² dx
 * (the standard perturbation of the Rayleigh quotient, e.g. Meirovitch, Fundamentals of
 * Vibrations, §7.5; from memory). Euler–Bernoulli form: use it with modes solved that way.
 * For the best accuracy the modes should come from a profile that has a station at each
 * cut station (applyCuts with zero depths gives one), so no element straddles a cut's kink.
 */
export function frequencySensitivity(bar: BarGeometry, modes: BarModes, stationsMm: readonly number[]): Float64Array[] {
  if (stationsMm.length === 0) throw new RangeError('at least one station is needed')
  for (let j = 1; j < stationsMm.length; j++) {
    if (!(stationsMm[j]! > stationsMm[j - 1]!)) throw new RangeError('stations must go from left to right without repeats')
  }
  const youngsModulusPa = bar.youngsModulusGPa * 1e9
  const nodes = modes.nodesM
  return modes.shapes.map((shape, m) => {
    const omega2 = (2 * Math.PI * modes.frequenciesHz[m]!) ** 2
    const numerator = new Float64Array(stationsMm.length)
    let bending = 0
    for (let e = 0; e < nodes.length - 1; e++) {
      const lengthM = nodes[e + 1]! - nodes[e]!
      for (let g = 0; g < GAUSS_POINTS.length; g++) {
        const xi = GAUSS_POINTS[g]!
        const xMm = (nodes[e]! + xi * lengthM) * 1000
        const hM = thicknessAtMm(bar.profile, xMm) / 1000
        const p = sectionProperties(hM, bar.widthMm / 1000, bar.densityKgM3, youngsModulusPa)
        const { value, curvature } = hermiteCubic(xi, lengthM)
        let w = 0
        let w2 = 0
        for (let i = 0; i < 4; i++) {
          w += value[i]! * shape[2 * e + i]!
          w2 += curvature[i]! * shape[2 * e + i]!
        }
        const weight = GAUSS_WEIGHTS[g]! * lengthM
        const energy = p.bendingStiffness * w2 * w2
        bending += weight * energy
        // Removing δh (mm) changes h by −δh; per mm of depth δh/h = −1 / (h in mm).
        const density = weight * (3 * energy - omega2 * p.massPerLength * w * w) / (hM * 1000)
        for (let j = 0; j < stationsMm.length; j++) {
          const hat = hatAt(stationsMm, j, xMm)
          if (hat > 0) numerator[j]! -= density * hat
        }
      }
    }
    return numerator.map(v => v / (2 * bending))
  })
}

/** The linear "hat" of station j at x: 1 at the station, 0 at its neighbours and beyond the outer ones. */
function hatAt(stations: readonly number[], j: number, x: number): number {
  const s = stations[j]!
  if (x === s) return 1
  if (x < s) {
    const left = stations[j - 1]
    return left === undefined || x <= left ? 0 : (x - left) / (s - left)
  }
  const right = stations[j + 1]
  return right === undefined || x >= right ? 0 : (right - x) / (right - s)
}
