import { describe, expect, it } from 'vitest'
import { bandSource } from '../../../../shared/analysis/bandSource'

const sampleRate = 48000
const signal = new Float64Array(100_000).map((_, n) => Math.cos(2 * Math.PI * (700 / sampleRate) * n))

/** A source whose tracks so far have cost more than its DFT (a rich strike), so that it decimates. */
function rented() {
  const bands = bandSource(signal, sampleRate)
  // 131072-point DFT: 131072 · 17 sample operations; a track costs 6 passes over its span.
  const full = bands(700, 20, 1000, 0, 131072 * 17 / 6)
  expect(full.factor).toBe(1)
  return bands
}

describe('bandSource', () => {
  it('serves the input itself until the tracks at its rate have cost about one DFT of it', () => {
    const bands = bandSource(signal, sampleRate)
    // 131072 · 17 = 2.23 M sample operations: after five tracks 2.1 M are spent, after six 2.52 M.
    for (let i = 0; i < 6; i++) expect(bands(700, 20, 1000, 0, 70_000).factor).toBe(1)
    expect(bands(700, 20, 1000, 0, 70_000).factor).toBe(512)
  })

  it('gives a band that holds the frequency ± the half-width clear of its edges, with a sample at the asked index', () => {
    const bands = rented()
    for (const [frequencyHz, halfWidthHz, maxFactor, alignIndex] of [[700, 20, 1000, 5003], [4321, 90, 200, 77], [60, 13, 5000, 0]] as const) {
      const band = bands(frequencyHz, halfWidthHz, maxFactor, alignIndex)
      expect(band.factor).toBeLessThanOrEqual(maxFactor)
      expect(band.factor).toBeGreaterThanOrEqual(16)
      // The band spans ± rate / 2 around its centre: the asked range lies within 3/8 of the rate.
      expect(Math.abs(frequencyHz - band.centerHz) + halfWidthHz).toBeLessThanOrEqual((3 / 8) * band.sampleRateHz + 1e-9)
      expect((alignIndex - band.firstIndex) % band.factor).toBe(0)
      expect(band.sampleRateHz * band.factor).toBe(sampleRate)
    }
  })

  it('makes a band once for the tracks that share it, and serves the input itself where the factor would be small', () => {
    const bands = rented()
    const shared = bands(700, 20, 1000, 64)
    expect(bands(702, 20, 1000, 64 + 3 * shared.factor) === shared).toBe(true)
    expect(bands(700, 20, 1000, 64) === bands(700, 20, 1000, 65)).toBe(false)
    const full = bands(700, 20, 4, 0)
    expect(full.factor).toBe(1)
    expect(full.re === signal).toBe(true)
    expect(full.centerHz).toBe(0)
  })

  it('gives each source its own signal\'s bands when two are used in turn (the transform\'s buffers are shared, never mixed up)', () => {
    const other = new Float64Array(100_000).map((_, n) => Math.cos(2 * Math.PI * (1900 / sampleRate) * n + 0.3))
    const alone = (x: Float64Array, frequencyHz: number, alignIndex: number) => {
      const bands = bandSource(x, sampleRate)
      bands(frequencyHz, 20, 1000, 0, 131072 * 17 / 6)
      return bands(frequencyHz, 20, 1000, alignIndex)
    }
    const expected = [alone(signal, 700, 5003), alone(other, 1900, 811)]
    const a = bandSource(signal, sampleRate)
    const b = bandSource(other, sampleRate)
    a(700, 20, 1000, 0, 131072 * 17 / 6)
    b(1900, 20, 1000, 0, 131072 * 17 / 6)
    // a's first decimated band, then b's (b takes the buffers over), then a's again on a new alignment.
    a(700, 20, 1000, 0)
    const fromB = b(1900, 20, 1000, 811)
    const fromA = a(700, 20, 1000, 5003)
    for (const [got, want] of [[fromA, expected[0]!], [fromB, expected[1]!]] as const) {
      // source: a unit cosine mixed down is a phasor of magnitude ½ (away from the signal's two ends).
      const middle = got.re.length >> 1
      expect(Math.hypot(got.re[middle]!, got.im[middle]!)).toBeCloseTo(0.5, 2)
      expect(got.firstIndex).toBe(want.firstIndex)
      expect(Array.from(got.re)).toEqual(Array.from(want.re))
      expect(Array.from(got.im)).toEqual(Array.from(want.im))
    }
  })

  it('refuses a negative half-width', () => {
    expect(() => bandSource(signal, sampleRate)(700, -1, 10)).toThrow(RangeError)
  })
})
