import type { MeasuredPartial } from '../analysis/types'
import { correctFrequencyHz } from './correctFrequencyHz'

/**
 * Partials read by an input whose clock offset is `offsetPpm` (positive: the input reads
 * high), with each frequency put on the reference's scale (correctFrequencyHz) and the
 * frequency as read kept in `rawFrequencyHz`. Cents-valued fields are ratios and need no
 * correction; times and decay rates are off by the same parts per million, far below what
 * they are reported to, and are left as read. New objects; the input is not changed.
 */
export function correctPartialsHz<P extends MeasuredPartial>(partials: readonly P[], offsetPpm: number): P[] {
  if (!(Number.isFinite(offsetPpm) && offsetPpm > -1e6)) throw new RangeError('correctPartialsHz needs a finite offset above −10⁶ ppm')
  return partials.map(p => ({ ...p, rawFrequencyHz: p.frequencyHz, frequencyHz: correctFrequencyHz(p.frequencyHz, offsetPpm) }))
}
