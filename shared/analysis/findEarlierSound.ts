import { energyBlockLength } from './units'

/** How close to the strike's loudest block an earlier sound must come to be named, dB (findStrike's lead-in rule). */
const WITHIN_PEAK_DB = 20
/** How far it must stand over the quiet just before the strike, dB (a steady rumble or hum never does). */
const OVER_QUIET_DB = 20
/** The strike's own rise is not searched: the quiet this long before its onset, s. */
const GUARD_S = 0.02

/**
 * The first sample of a loud sound before the strike's onset, or null: the first 1 ms block,
 * ending at least 20 ms before `onsetIndex`, whose RMS level comes within 20 dB of the
 * strike's loudest block (`peakDb`, dB re full scale RMS, as findStrike measures it) and
 * stands 20 dB over the mean level of the 20 ms before the onset (so a steady rumble or hum
 * as loud is no sound of its own). The strike is the loudest blow, so an earlier one (another
 * strike, a knock) was passed over, and what still rings of it lies under the strike measured.
 */
export function findEarlierSound(signal: Float64Array, sampleRate: number, onsetIndex: number, peakDb: number): number | null {
  if (!(sampleRate > 0) || !Number.isFinite(peakDb)) throw new RangeError('findEarlierSound needs a positive sample rate and a finite peak level')
  const block = energyBlockLength(sampleRate)
  const onset = Math.min(signal.length, Math.max(0, onsetIndex))
  const end = onset - Math.round(GUARD_S * sampleRate)
  if (end < block) return null
  let quiet = 0
  for (let i = end; i < onset; i++) quiet += signal[i]! * signal[i]!
  quiet /= onset - end
  const loud = Math.max(10 ** ((peakDb - WITHIN_PEAK_DB) / 10), quiet * 10 ** (OVER_QUIET_DB / 10))
  for (let start = 0; start + block <= end; start += block) {
    let energy = 0
    for (let i = start; i < start + block; i++) energy += signal[i]! * signal[i]!
    if (energy / block >= loud) return start
  }
  return null
}
