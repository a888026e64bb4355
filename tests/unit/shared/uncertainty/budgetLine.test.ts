import { describe, expect, it } from 'vitest'
import { budgetLine } from '../../../../shared/uncertainty/budgetLine'
import { combineBudget } from '../../../../shared/uncertainty/combineBudget'
import { typeAStandardUncertainty } from '../../../../shared/uncertainty/typeAStandardUncertainty'

describe('budgetLine', () => {
  it('divides by √3, √6 and k', () => {
    expect(budgetLine({ name: 'a', value: 1, unit: '¢', distribution: 'rectangular' }).standardUncertainty).toBeCloseTo(0.57735, 5) // source: JCGM 100:2008 §4.3.7, a/√3
    expect(budgetLine({ name: 'b', value: 1, unit: '¢', distribution: 'triangular' }).standardUncertainty).toBeCloseTo(0.40825, 5) // source: JCGM 100:2008 §4.3.9, a/√6
    expect(budgetLine({ name: 'c', value: 1, unit: '¢', distribution: 'normal', coverageFactor: 2 }).standardUncertainty).toBe(0.5) // source: JCGM 100:2008 §4.3.3, U/k
  })

  it('weights the contribution by the size of the sensitivity', () => {
    const line = budgetLine({ name: 'temperature', value: 2, unit: 'K', distribution: 'normal', sensitivity: -0.4 })
    expect(line.contribution).toBeCloseTo(0.8, 12)
  })
})

describe('combineBudget', () => {
  it('adds contributions in quadrature', () => {
    const lines = [3, 4].map(v => budgetLine({ name: String(v), value: v, unit: '¢', distribution: 'normal' }))
    const budget = combineBudget(lines, '¢')
    expect(budget.combinedStandardUncertainty).toBe(5) // source: JCGM 100:2008 §5.1.2, √(3² + 4²)
    expect(budget.expandedUncertainty).toBe(10)
  })
})

describe('typeAStandardUncertainty', () => {
  it('is the sample standard deviation over √n', () => {
    // source: JCGM 100:2008 §4.2.2–4.2.3; 2, 4, 4, 4, 5, 5, 7, 9: mean 5, Σd² = 32, s² = 32/7, s/√8 = 0.75593
    expect(typeAStandardUncertainty([2, 4, 4, 4, 5, 5, 7, 9])).toBeCloseTo(0.75593, 5)
    expect(typeAStandardUncertainty([1])).toBeNull()
    expect(() => typeAStandardUncertainty([1, Number.NaN])).toThrow(RangeError)
  })
})
