import { Matrix } from 'ml-matrix'
import type { CutPlan } from '../schemas/cutPlan'
import { applyCuts } from './applyCuts'
import { boundedLeastSquares } from './boundedLeastSquares'
import { checkBarGeometry } from './checkBarGeometry'
import { cutDepthLimitsMm } from './cutDepthLimitsMm'
import { cutPlanNote } from './cutPlanNote'
import { frequencySensitivity } from './frequencySensitivity'
import { isSymmetricProfile } from './isSymmetricProfile'
import { solveBarModes } from './solveBarModes'
import type { BarGeometry } from './types'
import { CENTS_PER_LOG } from '../analysis/units'

export interface PlannedPartial { ratio: number, cents: number, toleranceCents: number }

export interface CutPlanOptions {
  /** Deepest cut at one station, mm; default 3. */
  maxDepthMm?: number
  /** Thinnest the bar may become anywhere, mm; default half the thinnest point of the profile as given. */
  minThicknessMm?: number
  /** Evenly spaced cut stations from end to end; default 21 (one at the centre). */
  stations?: number
  /** Linearise–solve–re-solve rounds (a step that made things worse is halved in the next); default 6. */
  rounds?: number
  elements?: number
  /**
   * How far the workshop's cuts move a partial for each cent the model predicts (1: as the
   * model says). Predictions are scaled by it, so the depths are chosen for the hand that cuts.
   */
  handFactor?: number
}

/** Depths are given to the 0.05 mm a benchmaker can cut to. */
const DEPTH_STEP_MM = 0.05
/** Cost of 1 mm of cut, in squared tolerances: keeps cuts shallow and the problem well posed. */
const RIDGE = 1e-3
/** Cost of the total depth (squared), which favours fewer cuts over many. */
const TOTAL = 1e-2

/**
 * Where and how deep to cut so that every tuned partial comes within tolerance. The
 * n-th partial by ratio is taken as the bar's n-th bending mode. Each round linearises
 * the modes' frequencies in the cut depths (frequencySensitivity), solves for further
 * non-negative depths within the limits by bounded NNLS (rows weighted by 1/tolerance,
 * aiming at 0 ¢), applies them and re-solves the model. Symmetric bars get mirrored cuts.
 * The depths are rounded to 0.05 mm before the final prediction, which is a full re-solve.
 * A bar already within tolerance everywhere gets no cut.
 */
export function planCuts(bar: BarGeometry, partials: readonly PlannedPartial[], options: CutPlanOptions = {}): CutPlan {
  checkBarGeometry(bar)
  if (partials.length === 0 || partials.length > 8) throw new RangeError('give one to eight partials')
  const count = options.stations ?? 21
  if (!Number.isInteger(count) || count < 3 || count > 101) throw new RangeError('stations must be a whole number from 3 to 101')
  const hand = options.handFactor ?? 1
  if (!(Number.isFinite(hand) && hand >= 0.1 && hand <= 10)) throw new RangeError('the hand factor must be between 0.1 and 10')
  const modeOf = rankByRatio(partials)
  const model = { modes: Math.max(4, partials.length), elements: options.elements }
  const before = solveBarModes(bar, model).frequenciesHz
  const stationsMm = Array.from({ length: count }, (_, j) => (bar.lengthMm * j) / (count - 1))
  const thinnest = Math.min(...bar.profile.map(p => p.thicknessMm))
  const minThicknessMm = options.minThicknessMm ?? thinnest / 2
  const maxDepthMm = options.maxDepthMm ?? 3
  const limits = cutDepthLimitsMm(bar.profile, stationsMm, { maxDepthMm, minThicknessMm })
  const groups = stationGroups(count, isSymmetricProfile(bar.profile, bar.lengthMm))
  const depths = new Float64Array(count)
  const centsAfter = (modesHz: Float64Array) => partials.map((p, i) => p.cents + hand * 1200 * Math.log2(modesHz[modeOf[i]!]! / before[modeOf[i]!]!))
  const cut = () => ({ ...bar, profile: applyCuts(bar.profile, stationsMm.map((xMm, j) => ({ xMm, depthMm: depths[j]! }))) })
  const alreadyWithin = partials.every(p => Math.abs(p.cents) <= p.toleranceCents)

  // The best depths seen, by the re-solved model: a linearised step can overshoot on a strongly
  // undercut bar, and a plan must never be worse than not cutting.
  const misfit = (cents: number[]) => cents.reduce((sum, c, i) => sum + (c / partials[i]!.toleranceCents) ** 2, 0)
  let best = { misfit: Number.POSITIVE_INFINITY, depths: depths.slice() }
  const keepIfBest = (cents: number[]) => {
    const m = misfit(cents)
    if (m < best.misfit) best = { misfit: m, depths: depths.slice() }
    return m <= best.misfit
  }
  // The last step taken from the best depths: halved and tried again when it made things worse.
  let lastStep = new Float64Array(count)
  const rounds = alreadyWithin ? 0 : options.rounds ?? 6
  let evaluated = true
  for (let round = 0; round < rounds; round++) {
    const current = cut()
    const modes = solveBarModes(current, model)
    const cents = centsAfter(modes.frequenciesHz)
    evaluated = true
    if (!keepIfBest(cents)) {
      lastStep = lastStep.map(v => v / 2)
      depths.set(best.depths.map((d, j) => Math.min(limits[j]!, d + lastStep[j]!)))
      evaluated = false
      continue
    }
    if (cents.every((c, i) => Math.abs(c) <= partials[i]!.toleranceCents / 4)) break
    const sensitivity = frequencySensitivity(current, modes, stationsMm)
    const rows = partials.length + groups.length + 1
    const a = Matrix.zeros(rows, groups.length)
    const b = new Float64Array(rows)
    partials.forEach((p, i) => {
      groups.forEach((g, k) => a.set(i, k, g.reduce((s, j) => s + hand * CENTS_PER_LOG * sensitivity[modeOf[i]!]![j]!, 0) / p.toleranceCents))
      b[i] = -cents[i]! / p.toleranceCents
    })
    groups.forEach((g, k) => {
      a.set(partials.length + k, k, Math.sqrt(RIDGE) * g.length)
      a.set(rows - 1, k, Math.sqrt(TOTAL) * g.length)
    })
    const room = Float64Array.from(groups, g => Math.min(...g.map(j => limits[j]! - depths[j]!)))
    const step = boundedLeastSquares(a, b, room)
    if (step.every(v => v < 1e-4)) break
    evaluated = false
    groups.forEach((g, k) => g.forEach((j) => {
      lastStep[j] = step[k]!
      depths[j] = Math.min(limits[j]!, depths[j]! + step[k]!)
    }))
  }

  if (!evaluated) keepIfBest(centsAfter(solveBarModes(cut(), model).frequenciesHz))
  if (rounds > 0) depths.set(best.depths)

  // To the 0.05 mm a benchmaker can cut, never past a limit.
  const steps = 1 / DEPTH_STEP_MM
  for (let j = 0; j < count; j++) depths[j] = Math.min(Math.round(depths[j]! * steps), Math.floor(limits[j]! * steps + 1e-9)) / steps
  const after = depths.some(d => d > 0) ? centsAfter(solveBarModes(cut(), model).frequenciesHz) : partials.map(p => p.cents)
  const predicted = partials.map((p, i) => ({ ratio: p.ratio, centsBefore: p.cents, centsAfter: after[i]! }))
  const feasible = predicted.every((p, i) => Math.abs(p.centsAfter) <= partials[i]!.toleranceCents)
  const atLimit = depths.some((d, j) => limits[j]! - d < DEPTH_STEP_MM)
  const note = cutPlanNote(predicted, partials, { feasible, anyCut: depths.some(d => d > 0), atLimit, maxDepthMm, minThicknessMm })
  return {
    modesHz: Array.from(before),
    stations: stationsMm.map((xMm, j) => ({ xMm: Math.round(xMm * 100) / 100, depthMm: depths[j]! })),
    predicted,
    feasible,
    ...(note ? { note } : {}),
  }
}

/** Mode index (0 = fundamental) of each partial: its rank by ratio. */
function rankByRatio(partials: readonly PlannedPartial[]): number[] {
  const order = partials.map((_, i) => i).sort((i, j) => partials[i]!.ratio - partials[j]!.ratio)
  const rank: number[] = []
  order.forEach((i, r) => {
    rank[i] = r
  })
  return rank
}

/** Stations planned together: mirrored pairs (and the centre alone) on a symmetric bar, else one by one. */
function stationGroups(count: number, symmetric: boolean): number[][] {
  if (!symmetric) return Array.from({ length: count }, (_, j) => [j])
  return Array.from({ length: Math.ceil(count / 2) }, (_, j) => (j === count - 1 - j ? [j] : [j, count - 1 - j]))
}
