import { DB_PER_NEPER } from './units'

/**
 * Energy of a damped component from `fromS` to `toS` after its reference sample:
 * a²·(e^{−2αt₀} − e^{−2αt₁}) / 2α, α in nepers/s (a²·(t₁ − t₀) without decay). Ranks the
 * components of one band by what they carry while a reading looked, not by their amplitude
 * at the reference, where a fast burst of the attack may stand over everything.
 */
export function componentEnergy(c: { amplitude: number, decayDbPerS: number }, fromS: number, toS: number): number {
  if (!(toS >= fromS)) throw new RangeError('componentEnergy needs a span that does not run backwards')
  const alpha = c.decayDbPerS / DB_PER_NEPER
  const x = 2 * alpha * (toS - fromS)
  return c.amplitude ** 2 * Math.exp(-2 * alpha * fromS) * (Math.abs(x) < 1e-9 ? toS - fromS : -Math.expm1(-x) / (2 * alpha))
}
