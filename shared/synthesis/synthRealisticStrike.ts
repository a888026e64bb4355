// Synthetic strikes for demo data, tests and benchmarks (not part of the measurement).
import { schroederReverb } from './schroederReverb'
import { seededRandom } from './seededRandom'
import type { SynthPartial } from './synthStrike'

/** A mode of a realistic strike: a decaying sinusoid, optionally amplitude-modulated. */
export interface RealisticPartial extends SynthPartial {
  /** Tremolo: envelope × (1 + index · cos(2π rate t + phase)); index 0…1; phase 0 (a swell at the blow) unless given. */
  tremolo?: { rateHz: number, index: number, phaseRad?: number }
}

export interface RealisticOptions {
  sampleRate: number
  durationS: number
  onsetS: number
  seed?: number
  /** Mallet contact: a burst of white noise at the onset, peak level dB FS, fading in `durationS`. */
  mallet?: { levelDb: number, durationS: number }
  /** Mains hum at `frequencyHz` (50 or 60) and its harmonics 2…5 (each 6 dB lower), fundamental level dB FS. */
  hum?: { frequencyHz: number, levelDb: number }
  /** A room's tail (Schroeder reverberator): T60 in s and level of the tail against the strike, dB. */
  room?: { t60S: number, wetDb: number }
  /** Background white noise over the whole recording, RMS dB FS. */
  noiseDb?: number
}

/** Peak-to-trough depth in dB of a tremolo of modulation index m (0 ≤ m < 1). */
export function tremoloDepthDb(index: number): number {
  return 20 * Math.log10((1 + index) / (1 - index))
}

/**
 * A strike with what real recordings hold, for tests with known truth: modal synthesis
 * (a sum of exponentially decaying sinusoids — doublets and fast-dying high modes are
 * just partials given so), tremolo on chosen modes, a mallet-contact noise burst, a
 * room's reverberant tail, mains hum with harmonics and background noise.
 */
export function synthRealisticStrike(partials: RealisticPartial[], options: RealisticOptions): Float64Array {
  const { sampleRate, durationS, onsetS } = options
  const n = Math.round(durationS * sampleRate)
  const onset = Math.round(onsetS * sampleRate)
  const random = seededRandom(options.seed ?? 1)
  let out: Float64Array = new Float64Array(n)
  for (const p of partials) {
    const a = 10 ** (p.amplitudeDb / 20)
    const w = (2 * Math.PI * p.frequencyHz) / sampleRate
    const perSample = 10 ** (-p.decayDbPerS / 20 / sampleRate)
    const phase = p.phaseRad ?? random.uniform() * 2 * Math.PI
    const tremoloW = p.tremolo ? (2 * Math.PI * p.tremolo.rateHz) / sampleRate : 0
    const index = p.tremolo?.index ?? 0
    const tremoloPhase = p.tremolo?.phaseRad ?? 0
    let env = a
    for (let i = onset; i < n && env > 1e-9; i++) {
      const t = i - onset
      out[i]! += env * (1 + index * Math.cos(tremoloW * t + tremoloPhase)) * Math.cos(w * t + phase)
      env *= perSample
    }
  }
  if (options.mallet) {
    const level = 10 ** (options.mallet.levelDb / 20)
    const length = Math.round(options.mallet.durationS * sampleRate)
    for (let t = 0; t < length && onset + t < n; t++) out[onset + t]! += level * (1 - t / length) ** 2 * (2 * random.uniform() - 1)
  }
  if (options.room) out = schroederReverb(out, sampleRate, options.room.t60S, options.room.wetDb)
  if (options.hum) {
    for (let h = 1; h <= 5; h++) {
      const a = 10 ** ((options.hum.levelDb - 6 * (h - 1)) / 20)
      const w = (2 * Math.PI * h * options.hum.frequencyHz) / sampleRate
      const phase = random.uniform() * 2 * Math.PI
      for (let i = 0; i < n; i++) out[i]! += a * Math.cos(w * i + phase)
    }
  }
  if (options.noiseDb !== undefined) {
    const sigma = 10 ** (options.noiseDb / 20)
    for (let i = 0; i < n; i++) out[i]! += sigma * random.normal()
  }
  return out
}
