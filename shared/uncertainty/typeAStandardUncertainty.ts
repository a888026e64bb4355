/**
 * Type A standard uncertainty of the mean of n readings: s(q̄) = s(q)/√n, s the sample
 * standard deviation with n − 1 in the denominator (JCGM 100:2008 §4.2.2–§4.2.3).
 * Fewer than two readings give no spread: null.
 */
export function typeAStandardUncertainty(readings: readonly number[]): number | null {
  const n = readings.length
  if (readings.some(r => !Number.isFinite(r))) throw new RangeError('typeAStandardUncertainty needs finite readings')
  if (n < 2) return null
  let mean = 0
  for (const r of readings) mean += r
  mean /= n
  let squares = 0
  for (const r of readings) squares += (r - mean) ** 2
  return Math.sqrt(squares / (n - 1)) / Math.sqrt(n)
}
