/**
 * Loss factor η of a mode from its decay rate: η = D / (27.29 · f), with D in dB/s and f in Hz
 * (27.29 = 20 log₁₀ e · π; Cremer & Heckl, Structure-Borne Sound).
 */
export function lossFactorFromDecay(decayDbPerS: number, frequencyHz: number): number {
  if (!(decayDbPerS >= 0) || !(frequencyHz > 0)) throw new RangeError('the decay must not be negative and the frequency must be positive')
  return decayDbPerS / (20 * Math.LOG10E * Math.PI * frequencyHz)
}
