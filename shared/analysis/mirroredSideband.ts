import { basebandDtft } from './basebandDtft'
import type { Baseband } from './decimateBand'
import type { RefinedPeak } from './refinePeak'

/** A tremolo's second sideband, mirrored about the carrier, lies within this of the first, dB. */
export const MIRROR_WITHIN_DB = 10

/**
 * A close pair that is a carrier and one sideband of a tremolo: the spectrum at the
 * carrier's other side, mirrored, is within 10 dB of the first sideband (a second partial
 * leaves only its partner's skirt there). Returns the carrier, the rate and the depth
 * 20·log10((1 + m)/(1 − m)) with m = (S₋ + S₊)/C, or null for a true pair.
 */
export function mirroredSideband(windowed: Baseband, pair: [RefinedPeak, RefinedPeak]) {
  const [carrier, side] = pair[0].magnitude >= pair[1].magnitude ? pair : [pair[1], pair[0]]
  const mirrorHz = 2 * carrier.frequencyHz - side.frequencyHz
  const [mirrorX] = basebandDtft(windowed, [mirrorHz])
  const mirror = Math.hypot(mirrorX!.re, mirrorX!.im)
  if (!(mirror > side.magnitude * 10 ** (-MIRROR_WITHIN_DB / 20))) return null
  const index = Math.min(0.98, (mirror + side.magnitude) / carrier.magnitude)
  return { carrier, rateHz: Math.abs(side.frequencyHz - carrier.frequencyHz), depthDb: 20 * Math.log10((1 + index) / (1 - index)) }
}
