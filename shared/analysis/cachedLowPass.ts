import { kaiserLowPass } from './kaiserLowPass'

/** Designs already made, by factor, passband and attenuation (the same few recur for every partial). */
const designs = new Map<string, Float64Array>()

/**
 * The Kaiser low-pass (kaiserLowPass) of a down-mix by `factor` whose passband is ±`passband` of
 * the output rate and whose stopband starts at 1 − `passband` of it (nothing folds into the
 * passband), kept for reuse: shared between calls, read only.
 */
export function cachedLowPass(factor: number, passband: number, attenuationDb: number): Float64Array {
  const key = `${factor}/${passband}/${attenuationDb}`
  let taps = designs.get(key)
  if (!taps) {
    taps = kaiserLowPass(1 / (2 * factor), (1 - 2 * passband) / factor, { attenuationDb })
    if (designs.size >= 64) designs.delete(designs.keys().next().value!)
    designs.set(key, taps)
  }
  return taps
}
