// Synthetic strikes for demo data, tests and benchmarks (not part of the measurement).
import { seededRandom } from './seededRandom'

/** One exponentially decaying sinusoid of a synthetic strike. */
export interface SynthPartial {
  frequencyHz: number
  /** Peak amplitude at the onset, dB re full scale. */
  amplitudeDb: number
  /** Decay of the envelope in dB/s. */
  decayDbPerS: number
  phaseRad?: number
}

export interface SynthOptions {
  sampleRate: number
  durationS: number
  /** Time of the strike, in s (silence, or noise only, before it). */
  onsetS?: number
  /** RMS of added white Gaussian noise, dB re full scale; omitted: no noise. */
  noiseDb?: number
  seed?: number
}

/**
 * An exact synthetic strike: Σ A_k · 10^(−d_k t / 20) · cos(2π f_k t + φ_k) for t ≥ onset,
 * plus seeded white Gaussian noise over the whole recording.
 */
export function synthStrike(partials: SynthPartial[], options: SynthOptions): Float64Array {
  const { sampleRate, durationS } = options
  const onsetS = options.onsetS ?? 0
  const n = Math.round(durationS * sampleRate)
  const out = new Float64Array(n)
  const onset = Math.round(onsetS * sampleRate)
  const random = seededRandom(options.seed ?? 1)
  for (const p of partials) {
    const a = 10 ** (p.amplitudeDb / 20)
    const w = (2 * Math.PI * p.frequencyHz) / sampleRate
    const decayPerSample = 10 ** (-p.decayDbPerS / 20 / sampleRate)
    const phase = p.phaseRad ?? random.uniform() * 2 * Math.PI
    let env = a
    for (let i = onset; i < n; i++) {
      out[i]! += env * Math.cos(w * (i - onset) + phase)
      env *= decayPerSample
    }
  }
  if (options.noiseDb !== undefined) {
    const sigma = 10 ** (options.noiseDb / 20)
    for (let i = 0; i < n; i++) out[i]! += sigma * random.normal()
  }
  return out
}
