import { describe, expect, it } from 'vitest'
import { directDft } from '../../../../shared/analysis/directDft'
import { dtftPowers3 } from '../../../../shared/analysis/dtftPowers3'

/** Seeded uniform noise in [−1, 1) (a 32-bit LCG, Numerical Recipes constants). */
function noise(n: number, seed: number): Float64Array {
  const out = new Float64Array(n)
  let state = seed >>> 0
  for (let i = 0; i < n; i++) {
    state = (Math.imul(state, 1664525) + 1013904223) >>> 0
    out[i] = state / 2 ** 31 - 1
  }
  return out
}

describe('dtftPowers3', () => {
  it('equals |X[k]|² of the direct DFT at three bin frequencies', () => {
    // source: Goertzel (1958) — the recurrence yields the DFT bin exactly (up to rounding)
    const n = 256
    const sampleRate = 1000
    const x = noise(n, 7)
    const dft = directDft(x)
    const power = (k: number) => dft[2 * k]! ** 2 + dft[2 * k + 1]! ** 2
    const [p5, p40, p99] = dtftPowers3(x, (5 * sampleRate) / n, (40 * sampleRate) / n, (99 * sampleRate) / n, sampleRate)
    expect(p5 / power(5)).toBeCloseTo(1, 10)
    expect(p40 / power(40)).toBeCloseTo(1, 10)
    expect(p99 / power(99)).toBeCloseTo(1, 10)
  })

  it('gives (A·N/2)² for a sinusoid on a bin and nearly nothing on the other bins', () => {
    // source: DFT of A·cos(2πkn/N) is A·N/2 at bin k (orthogonality of the DFT basis)
    const n = 96000
    const sampleRate = 48000
    const amplitude = 0.3
    const k = 1047
    const x = new Float64Array(n)
    for (let i = 0; i < n; i++) x[i] = amplitude * Math.cos((2 * Math.PI * k * i) / n + 0.4)
    const binHz = sampleRate / n
    const [below, at, above] = dtftPowers3(x, (k - 3) * binHz, k * binHz, (k + 5) * binHz, sampleRate)
    expect(Math.sqrt(at) / ((amplitude * n) / 2)).toBeCloseTo(1, 8)
    expect(Math.sqrt(below) / Math.sqrt(at)).toBeLessThan(1e-8)
    expect(Math.sqrt(above) / Math.sqrt(at)).toBeLessThan(1e-8)
  })
})
