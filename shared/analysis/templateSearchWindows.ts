import { centsBetween } from './centsBetween'

/**
 * Half-width of each template partial's search window around its target, in cents: the
 * template's window, narrowed to half the distance to the neighbouring targets so that two
 * template partials never claim the same measured partial.
 */
export function templateSearchWindows(targetsHz: readonly number[], searchWindowCents: number): number[] {
  if (!(searchWindowCents > 0)) throw new RangeError('templateSearchWindows needs a positive search window')
  return targetsHz.map((targetHz, i) => {
    let windowCents = searchWindowCents
    for (let j = 0; j < targetsHz.length; j++) {
      if (j !== i) windowCents = Math.min(windowCents, Math.abs(centsBetween(targetsHz[j]!, targetHz)) / 2)
    }
    return windowCents
  })
}
