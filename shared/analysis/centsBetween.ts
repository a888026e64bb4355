/**
 * Interval in cents from `targetHz` up to `measuredHz`: 1200 · log2(measured / target).
 * Positive means sharp, negative flat.
 */
export function centsBetween(measuredHz: number, targetHz: number): number {
  if (!(measuredHz > 0) || !(targetHz > 0)) throw new RangeError('centsBetween needs two positive frequencies')
  return 1200 * Math.log2(measuredHz / targetHz)
}
