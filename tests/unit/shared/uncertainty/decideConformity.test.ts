import { describe, expect, it } from 'vitest'
import { decideConformity } from '../../../../shared/uncertainty/decideConformity'

// source: ILAC-G8:09/2019 §4.2.1 (simple acceptance, w = 0) and §4.2.2 (guarded acceptance, w = U)
describe('decideConformity', () => {
  const toleranceCents = 5
  const expandedCents = 0.8

  it('gives the guarded rule its three verdicts', () => {
    expect(decideConformity(3, toleranceCents, expandedCents, 'guarded')).toBe('pass') // 3 + 0.8 ≤ 5
    expect(decideConformity(4.5, toleranceCents, expandedCents, 'guarded')).toBe('conditional') // 4.5 + 0.8 > 5 ≥ 4.5 − 0.8
    expect(decideConformity(-5.5, toleranceCents, expandedCents, 'guarded')).toBe('conditional') // |Δ| − U = 4.7 ≤ 5
    expect(decideConformity(6, toleranceCents, expandedCents, 'guarded')).toBe('fail') // 6 − 0.8 = 5.2 > 5
  })

  it('passes under simple acceptance what is conditional under guarded acceptance', () => {
    expect(decideConformity(4.5, toleranceCents, expandedCents, 'simple')).toBe('pass')
    expect(decideConformity(-5.5, toleranceCents, expandedCents, 'simple')).toBe('fail')
  })

  it('treats the limits as inside', () => {
    expect(decideConformity(5, toleranceCents, 0, 'simple')).toBe('pass')
    expect(decideConformity(4.25, 5, 0.75, 'guarded')).toBe('pass') // 4.25 + 0.75 = 5 exactly (binary-exact values)
    expect(decideConformity(5.75, 5, 0.75, 'guarded')).toBe('conditional') // 5.75 − 0.75 = 5, not over
  })

  it('refuses a negative tolerance or uncertainty', () => {
    expect(() => decideConformity(1, -1, 0.5, 'simple')).toThrow(RangeError)
    expect(() => decideConformity(1, 5, -0.5, 'guarded')).toThrow(RangeError)
    expect(() => decideConformity(Number.NaN, 5, 0.5, 'guarded')).toThrow(RangeError)
  })
})
