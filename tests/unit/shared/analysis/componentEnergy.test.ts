import { describe, expect, it } from 'vitest'
import { componentEnergy } from '../../../../shared/analysis/componentEnergy'
import { DB_PER_NEPER } from '../../../../shared/analysis/units'

describe('componentEnergy', () => {
  it('is a²·(t₁ − t₀) without decay', () => {
    // source: ∫ a² dt over [t₀, t₁] (analytic)
    expect(componentEnergy({ amplitude: 0.5, decayDbPerS: 0 }, 0.2, 1.2)).toBeCloseTo(0.25, 12)
  })

  it('matches the integral of a²·e^{−2αt} taken numerically', () => {
    // source: ∫ a² e^{−2αt} dt = a²(e^{−2αt₀} − e^{−2αt₁}) / 2α (analytic); midpoint rule, 10⁵ steps
    const c = { amplitude: 0.3, decayDbPerS: 60 }
    const alpha = c.decayDbPerS / DB_PER_NEPER
    const [from, to, steps] = [0.05, 0.8, 100_000]
    let sum = 0
    for (let i = 0; i < steps; i++) sum += c.amplitude ** 2 * Math.exp(-2 * alpha * (from + ((i + 0.5) * (to - from)) / steps))
    expect(componentEnergy(c, from, to) / (sum * (to - from) / steps)).toBeCloseTo(1, 8)
  })

  it('ranks a slow partial over a louder fast burst over a long span, and refuses a span that runs backwards', () => {
    const partial = { amplitude: 10 ** (-30 / 20), decayDbPerS: 5 }
    const burst = { amplitude: 10 ** (-13 / 20), decayDbPerS: 400 }
    expect(componentEnergy(partial, 0.005, 1.005)).toBeGreaterThan(componentEnergy(burst, 0.005, 1.005))
    expect(componentEnergy(burst, 0, 0.01)).toBeGreaterThan(componentEnergy(partial, 0, 0.01))
    expect(() => componentEnergy(partial, 1, 0.5)).toThrow(RangeError)
  })
})
