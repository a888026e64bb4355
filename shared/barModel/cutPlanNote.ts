import { formatCents } from '../format/numbers'

/** The plain sentence beside a plan: nothing to do, or why no plan brings every partial within tolerance. */
export function cutPlanNote(
  predicted: readonly { ratio: number, centsBefore: number, centsAfter: number }[],
  partials: readonly { toleranceCents: number }[],
  state: { feasible: boolean, anyCut: boolean, atLimit: boolean, maxDepthMm: number, minThicknessMm: number },
): string | undefined {
  if (predicted.length !== partials.length) throw new RangeError('one tolerance per predicted partial is needed')
  if (state.feasible) return state.anyCut ? undefined : 'Every partial is already within tolerance: no cut is needed.'
  const outside = predicted.filter((p, i) => Math.abs(p.centsAfter) > partials[i]!.toleranceCents)
  const list = outside.map(p => `the partial at ratio ${p.ratio} would be ${formatCents(p.centsAfter)} ${p.centsAfter > 0 ? 'sharp' : 'flat'}`).join('; ')
  const why = state.atLimit
    ? ` The cuts it needs would go deeper than ${state.maxDepthMm.toFixed(2)} mm or leave the bar thinner than ${state.minThicknessMm.toFixed(2)} mm.`
    : ' Removing material cannot move these partials far enough independently of each other.'
  return `No plan within the limits brings every partial into tolerance: ${list}.${why}`
}
