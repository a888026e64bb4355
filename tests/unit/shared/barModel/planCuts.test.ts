import { describe, expect, it } from 'vitest'
import { applyCuts } from '../../../../shared/barModel/applyCuts'
import { defaultBarGeometry } from '../../../../shared/barModel/defaultBarGeometry'
import { planCuts } from '../../../../shared/barModel/planCuts'
import { solveBarModes } from '../../../../shared/barModel/solveBarModes'
import { ROSEWOOD_LIKE, uniformBar } from '../../../support/bars'

// A rosewood-like bar (E and ρ: tests/support/bars.ts, from memory), about F5 in size.
const bar = uniformBar(380, 55, 22, ROSEWOOD_LIKE.densityKgM3, ROSEWOOD_LIKE.youngsModulusGPa)
const cut = (stations: { xMm: number, depthMm: number }[]) => ({ ...bar, profile: applyCuts(bar.profile, stations) })
const centsMoved = (before: number, after: number) => 1200 * Math.log2(after / before)

describe('planCuts', () => {
  // Tolerances of a marimba template's fundamental and second partial. source: common practice (starter template, 3 ¢ and 5 ¢)
  const sharp = [{ ratio: 1, cents: 10, toleranceCents: 3 }, { ratio: 4, cents: 0, toleranceCents: 5 }]
  const plan = planCuts(bar, sharp)
  const cuts = plan.stations.filter(s => s.depthMm > 0)

  it('takes material from near the centre only when the fundamental is 10 ¢ sharp', () => {
    // source: thinning near the centre lowers the fundamental (the Bench's guidance; common practice)
    expect(plan.feasible).toBe(true)
    expect(cuts.length).toBeGreaterThan(0)
    for (const c of cuts) expect(Math.abs(c.xMm - 190)).toBeLessThanOrEqual(0.15 * 380)
    expect(Math.abs(plan.predicted[0]!.centsAfter)).toBeLessThanOrEqual(3)
    expect(Math.abs(plan.predicted[1]!.centsAfter)).toBeLessThanOrEqual(5)
    expect(plan.predicted.map(p => p.centsBefore)).toEqual([10, 0])
  })

  it('moves the modes as predicted, within 5 %, when its cuts are applied and the model asked again', () => {
    // source: the acceptance bound (5 %); the re-solve uses a finer mesh than the plan's
    const before = solveBarModes(bar, { elements: 80 }).frequenciesHz
    const after = solveBarModes(cut(plan.stations), { elements: 80 }).frequenciesHz
    const moved = centsMoved(before[0]!, after[0]!)
    const predicted = plan.predicted[0]!.centsAfter - plan.predicted[0]!.centsBefore
    expect(Math.abs(moved / predicted - 1)).toBeLessThan(0.05)
    expect(Math.abs(plan.modesHz[0]! / before[0]! - 1)).toBeLessThan(1e-5)
  })

  it('gives depths in steps of 0.05 mm, mirrored on a symmetric bar', () => {
    // source: 0.05 mm is the depth resolution the issue asks the plan to show
    for (const s of plan.stations) expect(Math.abs(s.depthMm * 20 - Math.round(s.depthMm * 20))).toBeLessThan(1e-9)
    const depths = plan.stations.map(s => s.depthMm)
    expect(depths).toEqual([...depths].reverse())
  })

  it('thins the ends to raise a flat fundamental', () => {
    // source: thinning the ends raises the fundamental (the Bench's guidance; common practice)
    const flat = planCuts(bar, [{ ratio: 1, cents: -10, toleranceCents: 3 }])
    expect(flat.feasible).toBe(true)
    for (const c of flat.stations.filter(s => s.depthMm > 0)) expect(Math.min(c.xMm, 380 - c.xMm)).toBeLessThan(0.2 * 380)
  })

  it('says so when the ends may not be cut deep enough to raise a flat fundamental', () => {
    const limited = planCuts(bar, [{ ratio: 1, cents: -10, toleranceCents: 3 }], { minThicknessMm: 21.9 })
    expect(limited.feasible).toBe(false)
    expect(limited.note).toMatch(/No plan .* ratio 1 .* flat/)
    for (const s of limited.stations) expect(s.depthMm).toBeLessThanOrEqual(0.1 + 1e-9)
  })

  it('plans no cut for a bar already within tolerance', () => {
    const within = planCuts(bar, [{ ratio: 1, cents: 2, toleranceCents: 3 }])
    expect(within.stations.every(s => s.depthMm === 0)).toBe(true)
    expect(within.feasible).toBe(true)
    expect(within.note).toMatch(/already within tolerance/)
  })

  it('never cuts deeper than the limit nor below the minimum thickness', () => {
    const hard = planCuts(bar, [{ ratio: 1, cents: 40, toleranceCents: 3 }, { ratio: 4, cents: -60, toleranceCents: 5 }], { maxDepthMm: 1, minThicknessMm: 20 })
    for (const s of hard.stations) expect(s.depthMm).toBeLessThanOrEqual(1 + 1e-9)
    const after = cut(hard.stations).profile
    for (const p of after) expect(p.thicknessMm).toBeGreaterThanOrEqual(21 - 1e-9)
  })
  it('cuts deeper for a hand that moves partials less than the model says, and predicts in the hand\'s cents', () => {
    // A hand at 0.5×: the model must move the fundamental twice as far, −20 ¢, for the bar to land on target.
    const halfHand = planCuts(bar, sharp, { handFactor: 0.5 })
    expect(halfHand.feasible).toBe(true)
    const modelMoved = centsMoved(halfHand.modesHz[0]!, solveBarModes(cut(halfHand.stations)).frequenciesHz[0]!)
    // The prediction is the hand's: half the model's own change (checked by hand: 10 + 0.5 · modelMoved).
    expect(halfHand.predicted[0]!.centsAfter).toBeCloseTo(10 + 0.5 * modelMoved, 6)
    // Within the 3 ¢ tolerance for the hand means the model itself moves −20 ± 6 ¢: twice as far as for a hand of 1.
    expect(modelMoved).toBeGreaterThanOrEqual(-26)
    expect(modelMoved).toBeLessThanOrEqual(-14)
    expect(() => planCuts(bar, sharp, { handFactor: 0 })).toThrow(RangeError)
  })
  it('plans shallow mirrored cuts for an undercut bar whose fundamental is 10 ¢ sharp, keeping the tuned second and third', () => {
    // C4 = 261.63 Hz (ISO 16:1975); tolerances 3, 5 and 10 ¢ (starter triple marimba template, common practice)
    const arch = defaultBarGeometry('bar', 261.6256, 'rosewood')
    const triple = [{ ratio: 1, cents: 10, toleranceCents: 3 }, { ratio: 4, cents: 0, toleranceCents: 5 }, { ratio: 10, cents: 0, toleranceCents: 10 }]
    const archPlan = planCuts(arch, triple)
    expect(archPlan.feasible).toBe(true)
    archPlan.predicted.forEach((p, i) => expect(Math.abs(p.centsAfter)).toBeLessThanOrEqual(triple[i]!.toleranceCents))
    const depths = archPlan.stations.map(s => s.depthMm)
    expect(depths).toEqual([...depths].reverse())
    for (const d of depths) expect(d).toBeLessThanOrEqual(1)
  })
})
