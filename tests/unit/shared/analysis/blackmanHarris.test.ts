import { describe, expect, it } from 'vitest'
import { BLACKMAN_HARRIS_COEFFICIENTS, blackmanHarris } from '../../../../shared/analysis/blackmanHarris'
import { realFft } from '../../../../shared/analysis/realFft'

/** Magnitude in dB (re the peak) of a window's transform, sampled `pad` times per bin. */
function windowResponseDb(length: number, pad: number): Float64Array {
  const w = blackmanHarris(length)
  const buffer = new Float64Array(length * pad)
  buffer.set(w)
  const spectrum = realFft(buffer)
  const half = (length * pad) / 2
  const db = new Float64Array(half)
  const peak = Math.hypot(spectrum[0]!, spectrum[1]!)
  for (let k = 0; k < half; k++) db[k] = 20 * Math.log10(Math.hypot(spectrum[2 * k]!, spectrum[2 * k + 1]!) / peak + 1e-300)
  return db
}

/** Index (in padded bins) of the first null of a response. */
function firstNull(db: Float64Array): number {
  let k = 1
  while (db[k + 1]! < db[k]!) k++
  return k
}

describe('blackmanHarris', () => {
  const pad = 64
  const db = windowResponseDb(256, pad)

  it('uses the minimum 4-term coefficients, which sum to 1', () => {
    // source: Harris (1978) Proc. IEEE 66(1) 51–83, minimum 4-term Blackman–Harris a0…a3
    expect([...BLACKMAN_HARRIS_COEFFICIENTS]).toEqual([0.35875, 0.48829, 0.14128, 0.01168])
    // source: Harris (1978), w(N/2) = a0 + a1 + a2 + a3 = 1 (normalised window)
    expect(BLACKMAN_HARRIS_COEFFICIENTS.reduce((a, b) => a + b, 0)).toBeCloseTo(1, 12)
  })

  it('has its first null at 4 bins (main lobe 8 bins wide)', () => {
    const k = firstNull(db)
    // source: Harris (1978) Proc. IEEE 66(1) 51–83, minimum 4-term Blackman–Harris, main lobe ±4 bins
    expect(k / pad).toBeGreaterThan(3.9)
    expect(k / pad).toBeLessThan(4.05)
  })

  it('has its highest sidelobe at −92 dB', () => {
    let highest = -Infinity
    for (let j = firstNull(db); j < db.length; j++) highest = Math.max(highest, db[j]!)
    // source: Harris (1978) Proc. IEEE 66(1) 51–83, Table 1: highest sidelobe −92 dB
    expect(highest).toBeGreaterThan(-93)
    expect(highest).toBeLessThan(-91.5)
  })

  it('has the tabulated coherent gain, noise bandwidth and 3 dB / 6 dB widths', () => {
    const n = 4096
    const w = blackmanHarris(n)
    let sum = 0
    let sumSq = 0
    for (const v of w) {
      sum += v
      sumSq += v * v
    }
    expect(sum / n).toBeCloseTo(0.36, 2) // source: Harris (1978) Table 1, coherent gain 0.36
    expect((n * sumSq) / sum ** 2).toBeCloseTo(2.0, 2) // source: Harris (1978) Table 1, ENBW 2.00 bins
    const width = (levelDb: number) => {
      let k = 0
      while (db[k]! > levelDb) k++
      return (2 * k) / pad
    }
    expect(width(-3.01)).toBeCloseTo(1.9, 1) // source: Harris (1978) Table 1, 3.0-dB bandwidth 1.90 bins
    expect(width(-6.02)).toBeCloseTo(2.72, 1) // source: Harris (1978) Table 1, 6.0-dB bandwidth 2.72 bins
  })

  it('equals the cosine-sum definition at every sample of a long window', () => {
    // source: Harris (1978), w[n] = a0 − a1 cos(2πn/N) + a2 cos(4πn/N) − a3 cos(6πn/N), periodic form
    const n = 5003
    const w = blackmanHarris(n)
    const [a0, a1, a2, a3] = BLACKMAN_HARRIS_COEFFICIENTS
    let worst = 0
    for (let i = 0; i < n; i++) {
      const x = (2 * Math.PI * i) / n
      worst = Math.max(worst, Math.abs(w[i]! - (a0 - a1 * Math.cos(x) + a2 * Math.cos(2 * x) - a3 * Math.cos(3 * x))))
    }
    expect(worst).toBeLessThan(1e-12)
  })

  it('is symmetric in its periodic form and refuses bad lengths', () => {
    const w = blackmanHarris(64)
    for (let n = 1; n < 64; n++) expect(w[n]).toBeCloseTo(w[64 - n]!, 14)
    expect(w[32]).toBeCloseTo(1, 12) // source: Harris (1978), a0 + a1 + a2 + a3 = 1 at the centre
    expect(w[0]).toBeCloseTo(0.35875 - 0.48829 + 0.14128 - 0.01168, 14) // source: Harris (1978), w[0] = a0 − a1 + a2 − a3
    expect(() => blackmanHarris(0)).toThrow(RangeError)
    expect(() => blackmanHarris(2.5)).toThrow(RangeError)
  })

  it('takes a period that need not be whole: w[n] = w(n / period), as Harris writes the window', () => {
    const [a0, a1, a2, a3] = BLACKMAN_HARRIS_COEFFICIENTS
    const period = 3000.4 / 7
    const w = blackmanHarris(429, period)
    for (const n of [0, 1, 100, 214, 300, 428]) {
      const x = (2 * Math.PI * n) / period
      expect(w[n]).toBeCloseTo(a0 - a1 * Math.cos(x) + a2 * Math.cos(2 * x) - a3 * Math.cos(3 * x), 12)
    }
    expect(Array.from(blackmanHarris(500, 500))).toEqual(Array.from(blackmanHarris(500)))
    expect(() => blackmanHarris(10, 0)).toThrow(RangeError)
  })
})
