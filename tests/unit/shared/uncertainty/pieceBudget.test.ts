import { describe, expect, it } from 'vitest'
import { pieceBudget, type PieceBudgetInput } from '../../../../shared/uncertainty/pieceBudget'

/*
 * A bar's fundamental at +4.6 ¢ against a ±5 ¢ tolerance, worked by hand.
 * source: JCGM 100:2008 §4.2.3, §4.3.7, §5.1.2, §6.2.1 (k = 2); ILAC-G8:09/2019 §4.2 for the rules.
 *   repeatability  4.4, 4.6, 4.8 ¢: s = 0.2, s/√3 = 0.115470 ¢
 *   estimator      0.2 ¢                                            → 0.2 ¢
 *   clock          0.5 ppm × 0.0017312 ¢/ppm                        → 0.000866 ¢
 *   drift          20 ppm rectangular: 20/√3 × 0.0017312            → 0.019991 ¢
 *   temperature    ±0.5 K rectangular (assumed) × 0.3 ¢/K: 0.5/√3 × 0.3 → 0.086603 ¢
 *   resolution     0.1 ¢ step: 0.1/√12                              → 0.028868 ¢
 *   Σ = 0.013333 + 0.04 + 0.00000075 + 0.00039964 + 0.0075 + 0.00083333 = 0.062067
 *   u = 0.24913 ¢, U = 0.49826 ¢; |Δ| + U = 5.098 ¢ > 5 ¢ ≥ |Δ| = 4.6 ¢
 */
const input = (over: Partial<PieceBudgetInput> = {}): PieceBudgetInput => ({
  matches: [
    { label: 'f1', cents: 4.6, toleranceCents: 5, required: true, missing: false, uncertaintyCents: 0.2 },
    { label: 'f2', cents: -1, toleranceCents: 10, required: false, missing: false, uncertaintyCents: null },
  ],
  finalState: [[{ label: 'f1', cents: 4.6 }], [{ label: 'f1', cents: 4.4 }], [{ label: 'f1', cents: 4.8 }]],
  clock: { state: 'calibrated', device: 'Bench interface A', calibratedAt: '2026-11-01T00:00:00.000Z', offsetPpm: 40, uncertaintyPpm: 0.5, referenceUncertaintyPpm: 0.1, expired: false, driftPpm: 20 },
  temperatureRecorded: true,
  temperatureCoefficientCentsPerK: -0.3,
  rule: 'simple',
  ...over,
})

describe('pieceBudget', () => {
  it('adds up the hand-worked budget of the fundamental', () => {
    const f1 = pieceBudget(input()).partials[0]!
    expect(f1.budget!.lines.map(l => l.name)).toEqual(['repeatability', 'estimator', 'clock calibration', 'clock drift since calibration', 'bench temperature', 'resolution'])
    expect(f1.budget!.combinedStandardUncertainty).toBeCloseTo(0.24913, 5)
    expect(f1.budget!.expandedUncertainty).toBeCloseTo(0.49826, 4)
    expect(f1.notAssessed).toEqual([])
    expect(f1.readingCount).toBe(3)
  })

  it('passes under simple acceptance what is conditional under guarded acceptance, and says the verdict depends on the rule', () => {
    const simple = pieceBudget(input())
    expect(simple.verdict).toBe('pass')
    expect(simple.verdictUnderOtherRule).toBe('conditional')
    expect(simple.dependsOnRule).toBe(true)
    const guarded = pieceBudget(input({ rule: 'guarded' }))
    expect(guarded.verdict).toBe('conditional')
    expect(guarded.partials[0]!.guarded).toBe('conditional')
  })

  it('does not depend on the rule when |Δ| + U is inside the tolerance', () => {
    const b = pieceBudget(input({ matches: [{ label: 'f1', cents: 2, toleranceCents: 5, required: true, missing: false, uncertaintyCents: 0.2 }] }))
    expect(b.verdict).toBe('pass')
    expect(b.dependsOnRule).toBe(false)
  })

  it('shows missing evidence as not assessed instead of guessing it', () => {
    const b = pieceBudget(input({ finalState: [[{ label: 'f1', cents: 4.6 }]], clock: { state: 'none' }, temperatureRecorded: false }))
    const f1 = b.partials[0]!
    expect(f1.budget!.lines.map(l => l.name)).toEqual(['estimator', 'resolution'])
    expect(f1.notAssessed.map(g => g.name)).toEqual(['repeatability', 'clock calibration', 'bench temperature'])
    const f2 = b.partials[1]!
    expect(f2.notAssessed.map(g => g.name)).toContain('estimator')
  })

  it('says drift is not assessed for a device with one calibration', () => {
    const clock = { ...input().clock, driftPpm: null } as PieceBudgetInput['clock']
    const f1 = pieceBudget(input({ clock })).partials[0]!
    expect(f1.notAssessed.map(g => g.name)).toEqual(['clock drift since calibration'])
    expect(f1.budget!.lines.some(l => l.name === 'clock drift since calibration')).toBe(false)
  })

  it('gives a piece with a missing required partial no verdict', () => {
    const b = pieceBudget(input({ matches: [{ label: 'f1', cents: null, toleranceCents: 5, required: true, missing: true, uncertaintyCents: null }] }))
    expect(b.verdict).toBeNull()
    expect(b.partials[0]!.budget).toBeNull()
  })
})
