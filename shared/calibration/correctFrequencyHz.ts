/**
 * A frequency read by an input whose clock offset is `offsetPpm` (positive: the input reads
 * high), corrected to the reference's scale: f / (1 + offset·10⁻⁶). Every frequency the input
 * reads is off by the same ratio, since the error is in the sample rate.
 */
export function correctFrequencyHz(measuredHz: number, offsetPpm: number): number {
  if (!(measuredHz > 0 && Number.isFinite(measuredHz))) throw new RangeError('correctFrequencyHz needs a positive frequency')
  if (!(Number.isFinite(offsetPpm) && offsetPpm > -1e6)) throw new RangeError('correctFrequencyHz needs a finite offset above −10⁶ ppm')
  return measuredHz / (1 + offsetPpm * 1e-6)
}
