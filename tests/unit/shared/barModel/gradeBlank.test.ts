import { describe, expect, it } from 'vitest'
import { gradeBlank } from '../../../../shared/barModel/gradeBlank'
import { lossFactorFromDecay } from '../../../../shared/barModel/lossFactorFromDecay'
import { youngsModulusFromF1 } from '../../../../shared/barModel/youngsModulusFromF1'

/** f₁ of a uniform free–free bar. source: f₁ = (4.7300² / 2π L²) √(E I / ρ A), I / A = t² / 12 (Blevins, Formulas for Natural Frequency and Mode Shape, table 8-1) */
const handbookF1 = (eGPa: number, rho: number, lengthM: number, thicknessM: number) =>
  (4.7300 ** 2 / (2 * Math.PI * lengthM ** 2)) * Math.sqrt((eGPa * 1e9 * thicknessM ** 2) / (12 * rho))

describe('youngsModulusFromF1', () => {
  it('gets E back from the handbook frequency of a known bar within 0.01 %', () => {
    const f1 = handbookF1(18, 950, 0.42, 0.024)
    const e = youngsModulusFromF1(f1, { lengthM: 0.42, thicknessM: 0.024, densityKgM3: 950 })
    expect(Math.abs(e / 18e9 - 1)).toBeLessThan(1e-4)
  })
})

describe('lossFactorFromDecay', () => {
  it('uses 27.29 · f dB/s per unit of loss factor', () => {
    // source: Cremer & Heckl, Structure-Borne Sound: decay rate D = 27.3 η f dB/s
    expect(lossFactorFromDecay(27.29 * 500 * 0.002, 500)).toBeCloseTo(0.002, 5)
  })

  it('matches the decay of a damped oscillator, amplitude ∝ exp(−π η f t)', () => {
    // source: a lightly damped mode with loss factor η decays as exp(−η ω t / 2) (common practice)
    const eta = 0.008
    const f = 700
    const dbPerS = -20 * Math.log10(Math.exp(-Math.PI * eta * f * 1))
    expect(lossFactorFromDecay(dbPerS, f)).toBeCloseTo(eta, 9)
  })
})

describe('gradeBlank', () => {
  const blank = { lengthMm: 400, widthMm: 60, thicknessMm: 25, massG: 612, decayDbPerS: 40 }
  const rho = 612e-3 / (0.4 * 0.06 * 0.025)

  it('gives density, E, E/ρ and η of a blank whose first mode the handbook formula gives', () => {
    const graded = gradeBlank({ ...blank, f1Hz: handbookF1(21, rho, 0.4, 0.025) })
    // source: density = m / (L w t) (common practice)
    expect(graded.densityKgM3).toBeCloseTo(1020, 6)
    expect(Math.abs(graded.youngsModulusGPa / 21 - 1)).toBeLessThan(1e-4)
    expect(graded.specificModulus).toBeCloseTo(graded.youngsModulusGPa / 1.020, 9)
    expect(graded.lossFactor).toBeCloseTo(40 / (27.29 * handbookF1(21, rho, 0.4, 0.025)), 5)
    expect(gradeBlank({ ...blank, decayDbPerS: undefined, f1Hz: 900 }).lossFactor).toBeNull()
  })

  it('raises E for shear and rotary inertia by a part that grows as (t/L)²', () => {
    // source: the Timoshenko correction to a bending frequency is second order in t/L (e.g. ASTM E1876's T1 = 1 + 6.585 (t/L)² + …; from memory)
    const correction = (t: number) => {
      const g = gradeBlank({ ...blank, thicknessMm: t, massG: 612 * t / 25, f1Hz: handbookF1(21, rho, 0.4, t / 1000) })
      return g.youngsModulusTimoshenkoGPa / g.youngsModulusGPa - 1
    }
    const thick = correction(24)
    const thin = correction(12)
    expect(thick).toBeGreaterThan(0.01)
    expect(Math.abs(thick / thin / 4 - 1)).toBeLessThan(0.05)
  })
})
