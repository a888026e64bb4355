import { describe, expect, it } from 'vitest'
import { CENTS_PER_PPM, partialBudget } from '../../../../shared/uncertainty/partialBudget'

describe('partialBudget', () => {
  // Worked by hand, source: JCGM 100:2008 §4.2.3 (s(q̄) = s/√n), §4.3.7 (rectangular a/√3),
  // §5.1.2 (u² = Σ(cᵢuᵢ)²), §6.2.1 (U = k·u, k = 2).
  //   repeatability   readings 0.4, 0.6, 0.5 ¢: mean 0.5, Σd² = 0.02, s² = 0.02/2 = 0.01, s = 0.1, s/√3 = 0.057735 ¢
  //   estimator       0.05 ¢ (one standard deviation)                         → 0.05 ¢
  //   clock           10 ppm (k = 1) × 1200/(ln2·10⁶) = 10 × 0.0017312       → 0.017312 ¢
  //   drift           ±20 ppm rectangular: 20/√3 = 11.547 ppm × 0.0017312    → 0.019991 ¢
  //   temperature     ±0.5 K rectangular: 0.5/√3 = 0.28868 K × |−0.3| ¢/K    → 0.086603 ¢
  //   resolution      step 0.1 ¢: 0.1/√12                                     → 0.028868 ¢
  //   Σ(cᵢuᵢ)² = 0.0033333 + 0.0025 + 0.00029972 + 0.00039962 + 0.0075 + 0.00083333 = 0.014866
  //   u = √0.014866 = 0.12193 ¢, U = 2u = 0.24385 ¢
  const budget = partialBudget({
    readingsCents: [0.4, 0.6, 0.5],
    estimatorUncertaintyCents: 0.05,
    clockUncertaintyPpm: 10,
    clockDriftPpm: 20,
    temperatureUncertaintyK: 0.5,
    temperatureCoefficientCentsPerK: -0.3,
    resolutionCents: 0.1,
  })

  it('gives each line the hand-worked contribution', () => {
    const byName = Object.fromEntries(budget.lines.map(l => [l.name, l]))
    expect(byName.repeatability!.contribution).toBeCloseTo(0.057735, 6)
    expect(byName.estimator!.contribution).toBeCloseTo(0.05, 12)
    expect(byName['clock calibration']!.contribution).toBeCloseTo(0.017312, 6)
    expect(byName['clock drift since calibration']!.contribution).toBeCloseTo(0.019991, 6)
    expect(byName['clock drift since calibration']!.divisor).toBeCloseTo(Math.sqrt(3), 12)
    expect(byName['bench temperature']!.contribution).toBeCloseTo(0.086603, 6)
    expect(byName['bench temperature']!.sensitivity).toBe(-0.3)
    expect(byName.resolution!.contribution).toBeCloseTo(0.028868, 6)
    expect(budget.lines).toHaveLength(6)
  })

  it('combines them into u and U = 2u', () => {
    expect(budget.combinedStandardUncertainty).toBeCloseTo(0.12193, 5)
    expect(budget.coverageFactor).toBe(2)
    expect(budget.expandedUncertainty).toBeCloseTo(0.24385, 5)
    expect(budget.unit).toBe('¢')
  })

  it('uses the slope of the cent at zero offset as the clock sensitivity', () => {
    // source: definition of the cent, d/dx 1200·log2(1 + x) at 0 = 1200/ln 2
    expect(CENTS_PER_PPM).toBeCloseTo(0.0017312, 7)
  })

  it('leaves out components with no evidence and keeps the resolution', () => {
    const bare = partialBudget({ readingsCents: [0.2], estimatorUncertaintyCents: null, clockUncertaintyPpm: null, temperatureUncertaintyK: null, temperatureCoefficientCentsPerK: 0, resolutionCents: 0.1 })
    expect(bare.lines.map(l => l.name)).toEqual(['resolution'])
    expect(bare.combinedStandardUncertainty).toBeCloseTo(0.1 / Math.sqrt(12), 12) // source: JCGM 100:2008 §F.2.2.1, resolution δx → δx/√12
  })

  it('refuses a negative resolution or a negative stated value', () => {
    const base = { readingsCents: [], estimatorUncertaintyCents: null, clockUncertaintyPpm: null, temperatureUncertaintyK: null, temperatureCoefficientCentsPerK: 0, resolutionCents: 0.1 }
    expect(() => partialBudget({ ...base, resolutionCents: -1 })).toThrow(RangeError)
    expect(() => partialBudget({ ...base, estimatorUncertaintyCents: -0.1 })).toThrow(RangeError)
    expect(() => partialBudget({ ...base, temperatureCoefficientCentsPerK: Number.NaN })).toThrow(RangeError)
  })
})
