import { describe, expect, it } from 'vitest'
import { analyzeSamples } from '../../../../shared/analysis/analyzeSamples'
import { annotatePartials } from '../../../../shared/analysis/annotatePartials'
import type { FftPartial } from '../../../../shared/analysis/types'
import { synthStrike, type SynthPartial } from '../../../../shared/synthesis/synthStrike'
import { statisticalCents } from '../../../support/statisticalCents'

const sampleRate = 48000

/** An FFT reading of a partial as the pipeline would hand it over. */
function reading(frequencyHz: number, decayDbPerS: number, snrDb = 60): FftPartial {
  return { frequencyHz, amplitudeDb: -10, decayDbPerS, t60S: 60 / decayDbPerS, r2: 1, startS: 0, endS: 1, stabilityCents: 0, beatHz: null, snrDb, frames: 40 }
}

const truth: SynthPartial[] = [
  { frequencyHz: 261.63, amplitudeDb: -6, decayDbPerS: 15 },
  { frequencyHz: 1046.5, amplitudeDb: -18, decayDbPerS: 30 },
  { frequencyHz: 2616.3, amplitudeDb: -26, decayDbPerS: 45 },
]

describe('annotatePartials', () => {
  it('gives an uncertainty that matches the pencil\'s real scatter (from the data, not a constant)', () => {
    const deltas: number[] = []
    const uncertainties: number[] = []
    for (let seed = 1; seed <= 30; seed++) {
      const signal = synthStrike(truth, { sampleRate, durationS: 2, noiseDb: -45, seed })
      // FFT readings at the true values, so the cross-check is the pencil's own error.
      const out = annotatePartials(signal, sampleRate, truth.map(t => reading(t.frequencyHz, t.decayDbPerS, 40)), { startIndex: 0, endIndex: signal.length })
      for (const p of out.partials) {
        deltas.push(p.crossCheckCents!)
        // The line's allowance aside (its own test): the part the data give.
        uncertainties.push(statisticalCents(p))
      }
    }
    const rms = (v: number[]) => Math.sqrt(v.reduce((s, x) => s + x * x, 0) / v.length)
    // u² = bound² + Δ²/2 and E[Δ²] ≈ bound² for an efficient estimator, so RMS(Δ)/RMS(u) ≈ 1/√1.5 ≈ 0.82.
    expect(rms(deltas) / rms(uncertainties)).toBeGreaterThan(0.55)
    expect(rms(deltas) / rms(uncertainties)).toBeLessThan(1.1)
  }, 60_000)

  it('reports a misread partial as the difference in cents, with a warning', () => {
    const signal = synthStrike(truth, { sampleRate, durationS: 2, noiseDb: -70, seed: 9 })
    const misread = truth.map((t, k) => reading(k === 1 ? t.frequencyHz * 2 ** (3 / 1200) : t.frequencyHz, t.decayDbPerS))
    const out = annotatePartials(signal, sampleRate, misread, { startIndex: 0, endIndex: signal.length })
    expect(out.partials[1]!.crossCheckCents).toBeCloseTo(-3, 2)
    expect(Math.abs(out.partials[0]!.crossCheckCents!)).toBeLessThan(0.01)
    expect(out.warnings).toHaveLength(1)
    expect(out.warnings[0]).toContain('1048.32 Hz')
  })

  it('reads a low partial, not the attack transient beside it that starts louder and is gone in 50 ms', () => {
    // A marimba A1 whose band also holds a fast component of the attack (a mallet burst through a
    // room, as the pencil models it): 5 dB over the partial at the start, 850 dB/s.
    const bar = { frequencyHz: 55.02, amplitudeDb: -6, decayDbPerS: 5 }
    const signal = synthStrike([bar, { frequencyHz: 55.73, amplitudeDb: -1, decayDbPerS: 850 }], { sampleRate, durationS: 2, noiseDb: -72, seed: 4 })
    const out = annotatePartials(signal, sampleRate, [reading(bar.frequencyHz, bar.decayDbPerS)], { startIndex: 0, endIndex: signal.length })
    // source: the synthesised partial; the transient's energy over the 1 s span is 2.7 % of the partial's (a²/2α against a²(1 − e^{−2αT})/2α).
    expect(Math.abs(out.partials[0]!.crossCheckCents!)).toBeLessThan(0.05)
    expect(statisticalCents(out.partials[0]!)).toBeLessThan(0.05)
  })

  describe('a burst 20 dB over the partial, 600 dB/s, 2 Hz beside it (a mallet\'s contact)', () => {
    // source: the synthesised partial. Over the whole 1 s span the burst carries 2.6 times the
    // partial's energy (a²/2α: 100·A²/138 against A²(1 − e^{−3.45})/3.45).
    const partial = { frequencyHz: 523.25, amplitudeDb: -26, decayDbPerS: 15 }
    const signal = synthStrike([partial, { frequencyHz: 521.25, amplitudeDb: -6, decayDbPerS: 600 }], { sampleRate, durationS: 2, noiseDb: -90, seed: 6 })
    const read = (p: Partial<FftPartial> & { windowS?: number }, maxAmplitude?: number) =>
      annotatePartials(signal, sampleRate, [{ ...reading(partial.frequencyHz, partial.decayDbPerS), ...p }], { startIndex: 0, endIndex: signal.length, maxAmplitude }).partials[0]!

    it('is weighed over the time the track saw the partial, from its first frame on, so the partial is read', () => {
      // The track's first 0.1 s frame began at 0.15 s, when the burst was 90 dB down.
      const p = read({ startS: 0.2, windowS: 0.1 })
      expect(Math.abs(p.crossCheckCents!)).toBeLessThan(0.05)
      // Weighed from the span's start, the burst is taken for the partial.
      expect(Math.abs(read({ startS: 0 }).crossCheckCents!)).toBeGreaterThan(2)
    })

    it('counts for no more than the most any component can carry (maxAmplitude), so the partial is read', () => {
      // 0.1 of full scale is under the burst's 0.5 but over the partial's 0.05: clamped, the burst
      // carries 0.04 of its energy, 0.10 of the partial's, and its bound grows 5 times.
      expect(Math.abs(read({ startS: 0 }, 0.1).crossCheckCents!)).toBeLessThan(0.05)
    })
  })

  it('names every partial of one kind in one warning (a real strike has dozens)', () => {
    const signal = synthStrike(truth, { sampleRate, durationS: 2, noiseDb: -70, seed: 9 })
    const misread = truth.map(t => reading(t.frequencyHz * 2 ** (3 / 1200), t.decayDbPerS))
    const out = annotatePartials(signal, sampleRate, [...misread, reading(700, 20), reading(1700, 20)], { startIndex: 0, endIndex: signal.length })
    expect(out.warnings).toHaveLength(2)
    expect(out.warnings[0]).toMatch(new RegExp(`^At ${truth.length} partials, the high-resolution estimate differs`))
    for (const p of misread) expect(out.warnings[0]).toContain(`${p.frequencyHz.toFixed(2)} Hz by -3.00 ¢`)
    expect(out.warnings[1]).toBe('2 partials could not be cross-checked by the high-resolution estimator: 700.00 Hz, 1700.00 Hz')
    // Past ten, the lowest ten are named and the rest counted.
    const many = annotatePartials(signal, sampleRate, Array.from({ length: 12 }, (_, k) => reading(7100 - 100 * k, 20)), { startIndex: 0, endIndex: signal.length })
    expect(many.warnings).toEqual([`12 partials could not be cross-checked by the high-resolution estimator: ${Array.from({ length: 10 }, (_, k) => `${6000 + 100 * k}.00 Hz`).join(', ')} and 2 more`])
  })

  it('leaves the fields null, with a warning, where the pencil finds nothing', () => {
    const signal = synthStrike(truth, { sampleRate, durationS: 2, noiseDb: -70, seed: 9 })
    const out = annotatePartials(signal, sampleRate, [reading(700, 20)], { startIndex: 0, endIndex: signal.length })
    expect(out.partials[0]).toMatchObject({ crossCheckCents: null, uncertaintyCents: null, uncertaintyDecayPct: null })
    expect(out.warnings[0]).toContain('could not be cross-checked')
  })

  it('fills the three fields for every partial of a measured strike', () => {
    const signal = synthStrike(truth, { sampleRate, durationS: 3, onsetS: 0.05, noiseDb: -72, seed: 1 })
    const result = analyzeSamples(signal, sampleRate, { note: 'C4', ratios: [1, 4, 10] })
    expect(result.partials).toHaveLength(3)
    for (const p of result.partials) {
      expect(Math.abs(p.crossCheckCents!)).toBeLessThan(0.05)
      expect(p.uncertaintyCents).toBeGreaterThanOrEqual(0)
      expect(p.uncertaintyDecayPct).toBeGreaterThanOrEqual(0)
      expect(p.uncertaintyDecayPct).toBeLessThan(2)
    }
    expect(result.warnings.filter(w => w.includes('high-resolution'))).toEqual([])
  })

  it('adds a bent decay curve to the decay uncertainty as a rectangular allowance, bend / √3, and carries it into the frequency\'s', () => {
    // source: GUM (JCGM 100:2008) §4.3.7, a quantity known only to lie within ±a has u = a / √3.
    const signal = synthStrike(truth, { sampleRate, durationS: 2, noiseDb: -60, seed: 4 })
    const straight = annotatePartials(signal, sampleRate, [reading(1046.5, 30)], { startIndex: 0, endIndex: signal.length }).partials[0]!
    const bent = annotatePartials(signal, sampleRate, [{ ...reading(1046.5, 30), decayBendDbPerS: 3 }], { startIndex: 0, endIndex: signal.length }).partials[0]!
    // 3 dB/s of a 30 dB/s decay is 10 %, so 10 / √3 % joins the rest in quadrature.
    expect(bent.uncertaintyDecayPct! ** 2).toBeCloseTo(straight.uncertaintyDecayPct! ** 2 + (10 / Math.sqrt(3)) ** 2, 6)
    // √3 dB/s is 0.19941 Np/s, so 0.031737 Hz of angular pull: 0.052502 ¢ at 1046.5 Hz (1200·log2(1 + 0.031737/1046.5), arithmetic).
    expect(bent.uncertaintyCents! ** 2).toBeCloseTo(straight.uncertaintyCents! ** 2 + 0.052502 ** 2, 7)
    expect(bent.crossCheckCents).toBe(straight.crossCheckCents)
  })
})
