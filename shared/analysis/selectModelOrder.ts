/** Limits of the model order search. */
export interface ModelOrderLimits {
  /** Largest order considered. */
  maxOrder: number
  /** Smallest order returned (default 1). */
  minOrder?: number
}

/**
 * Number of exponentials in the data by the minimum description length rule of Wax &
 * Kailath (1985, IEEE Trans. ASSP 33(2) 387–392) on the eigenvalues λ = σ² of the data
 * matrix (its singular values σ, largest first, p of them, from `snapshots` rows):
 * MDL(k) = −snapshots·(p − k)·ln(geometric / arithmetic mean of λ_{k+1..p})
 *          + ½·k·(2p − k)·ln(snapshots).
 * The order with the smallest MDL wins, kept within [minOrder, maxOrder].
 */
export function selectModelOrder(singularValues: ArrayLike<number>, snapshots: number, limits: ModelOrderLimits): number {
  const p = singularValues.length
  const minOrder = limits.minOrder ?? 1
  if (p < 2) throw new RangeError('selectModelOrder needs at least two singular values')
  if (!(snapshots >= 1)) throw new RangeError('selectModelOrder needs at least one snapshot')
  if (!(Number.isInteger(minOrder) && Number.isInteger(limits.maxOrder) && minOrder >= 0 && limits.maxOrder >= minOrder)) {
    throw new RangeError('selectModelOrder needs whole limits with minOrder ≤ maxOrder')
  }
  const top = Math.min(limits.maxOrder, p - 1)
  const lambda = Array.from(singularValues, s => Math.max(s * s, Number.MIN_VALUE))
  let best = Math.min(minOrder, top)
  let bestScore = Infinity
  for (let k = 0; k <= top; k++) {
    let logSum = 0
    let sum = 0
    for (let i = k; i < p; i++) {
      logSum += Math.log(lambda[i]!)
      sum += lambda[i]!
    }
    const rest = p - k
    const logRatio = logSum / rest - Math.log(sum / rest)
    const score = -snapshots * rest * logRatio + 0.5 * k * (2 * p - k) * Math.log(snapshots)
    if (k >= minOrder && score < bestScore) {
      bestScore = score
      best = k
    }
  }
  return best
}
