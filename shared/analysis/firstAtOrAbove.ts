/**
 * Index of the first item whose frequency is at or above `hz` (strictly above when `after`, so
 * equal ones keep their order) in a list sorted by frequency: a binary search.
 */
export function firstAtOrAbove(sorted: readonly { frequencyHz: number }[], hz: number, after = false): number {
  let lo = 0
  let hi = sorted.length
  while (lo < hi) {
    const mid = (lo + hi) >> 1
    const f = sorted[mid]!.frequencyHz
    if (f < hz || (after && f === hz)) lo = mid + 1
    else hi = mid
  }
  return lo
}
