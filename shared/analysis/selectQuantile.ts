/**
 * The q-quantile (0 ≤ q ≤ 1) of `values`: the element of rank ⌊q·(n − 1)⌋ in sorted
 * order, found by quickselect (Hoare 1961) in O(n) on average. Uses `scratch` (or a
 * copy) as work space; never modifies `values`.
 */
export function selectQuantile(values: ArrayLike<number>, q: number, scratch?: Float64Array): number {
  const n = values.length
  if (n === 0) return Number.NaN
  const a = scratch && scratch.length >= n ? scratch : new Float64Array(n)
  for (let i = 0; i < n; i++) a[i] = values[i]!
  const k = Math.min(n - 1, Math.max(0, Math.floor(q * (n - 1))))
  let lo = 0
  let hi = n - 1
  while (hi > lo) {
    const pivot = a[(lo + hi) >> 1]!
    let i = lo
    let j = hi
    while (i <= j) {
      while (a[i]! < pivot) i++
      while (a[j]! > pivot) j--
      if (i <= j) {
        const t = a[i]!
        a[i] = a[j]!
        a[j] = t
        i++
        j--
      }
    }
    if (k <= j) hi = j
    else if (k >= i) lo = i
    else return a[k]!
  }
  return a[k]!
}
