import { basebandLevels } from './basebandLevels'
import { MAIN_LOBE_BINS } from './chooseWindow'
import type { Baseband } from './decimateBand'
import { refinePeak } from './refinePeak'

/**
 * Two local maxima of the long-window magnitude within ±`halfWidthHz` of `centreHz`
 * (a grid of half bins, then refined), the weaker no more than 30 dB under the
 * stronger and the two at least 0.9 half main lobes apart; null otherwise.
 */
export function findClosePair(windowed: Baseband, centreHz: number, halfWidthHz: number, binHz: number) {
  const step = binHz / 2
  const grid = basebandLevels(windowed, centreHz, Math.max(3 * step, halfWidthHz), step)
  const count = (grid.length - 1) / 2
  const levels = Array.from(grid)
  const maxima: { index: number, level: number }[] = []
  for (let i = 1; i < levels.length - 1; i++) {
    if (levels[i]! > levels[i - 1]! && levels[i]! >= levels[i + 1]!) maxima.push({ index: i, level: levels[i]! })
  }
  if (maxima.length < 2) return null
  maxima.sort((a, b) => b.level - a.level)
  const [first, second] = maxima as [(typeof maxima)[0], (typeof maxima)[0]]
  if (second.level < first.level - 30) return null
  const refined = [first, second]
    .map(m => refinePeak(windowed, centreHz + (m.index - count) * step, [0.25, 0.1]))
    .sort((a, b) => a.frequencyHz - b.frequencyHz) as [ReturnType<typeof refinePeak>, ReturnType<typeof refinePeak>]
  // Closer than 3.6 bins (0.9 × the half main lobe) the window cannot resolve the pair:
  // two maxima there come from the beating itself, not from two separable partials.
  if (refined[1].frequencyHz - refined[0].frequencyHz < 0.9 * (MAIN_LOBE_BINS / 2) * binHz) return null
  return refined
}
