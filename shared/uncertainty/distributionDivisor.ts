import type { Distribution } from './types'

/**
 * Divisor that turns a stated value into a standard uncertainty (JCGM 100:2008):
 * rectangular half-width a → a/√3 (§4.3.7), triangular half-width a → a/√6 (§4.3.9),
 * normal expanded uncertainty → U/k (§4.3.3; k = 1 for a value already a standard deviation).
 */
export function distributionDivisor(distribution: Distribution, coverageFactor = 1): number {
  if (distribution === 'rectangular') return Math.sqrt(3)
  if (distribution === 'triangular') return Math.sqrt(6)
  if (!(coverageFactor > 0 && Number.isFinite(coverageFactor))) throw new RangeError('distributionDivisor needs a positive coverage factor for a normal distribution')
  return coverageFactor
}
