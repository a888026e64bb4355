import { blackmanHarris } from '../analysis/blackmanHarris'
import { parabolicPeak } from '../analysis/parabolicPeak'
import { realFft } from '../analysis/realFft'

/** A magnitude spectrum: bin frequencies in Hz and levels in dB re a full-scale sine. */
export interface Spectrum {
  frequencyHz: Float64Array
  levelDb: Float64Array
}

const windows = new Map<number, { w: Float64Array, sum: number }>()

function windowOf(length: number) {
  let entry = windows.get(length)
  if (!entry) {
    const w = blackmanHarris(length)
    entry = { w, sum: w.reduce((a, b) => a + b, 0) }
    windows.set(length, entry)
    if (windows.size > 4) windows.delete(windows.keys().next().value as number)
  }
  return entry
}

/**
 * Blackman–Harris windowed spectrum of `size` samples from `start` (zero-padded past
 * the end), bins 1…size/2. Scaled so a full-scale sinusoid on a bin reads 0 dB
 * (amplitude = 2 |X| / Σw), the convention of the engine's amplitudes.
 */
export function magnitudeSpectrum(samples: ArrayLike<number>, sampleRate: number, start: number, size: number): Spectrum {
  const { w, sum } = windowOf(size)
  const frame = new Float64Array(size)
  const from = Math.max(0, Math.floor(start))
  const n = Math.min(size, samples.length - from)
  for (let i = 0; i < n; i++) frame[i] = samples[from + i]! * w[i]!
  const x = realFft(frame)
  const bins = size / 2
  const frequencyHz = new Float64Array(bins)
  const levelDb = new Float64Array(bins)
  for (let k = 1; k <= bins; k++) {
    const re = x[2 * k]!
    const im = x[2 * k + 1]!
    frequencyHz[k - 1] = (k * sampleRate) / size
    levelDb[k - 1] = 20 * Math.log10(Math.max((2 * Math.sqrt(re * re + im * im)) / sum, 1e-10))
  }
  return { frequencyHz, levelDb }
}

/**
 * A rough pitch for the live readout: the strongest peak of the spectrum between
 * `lowHz` and `highHz`, refined by parabolic interpolation of the dB magnitude.
 * Only a guide while striking; the verdict comes from the server's analysis.
 */
export function roughPitch(samples: ArrayLike<number>, sampleRate: number, lowHz = 25, highHz = 5000): { frequencyHz: number, levelDb: number } | null {
  let size = 1
  while (size * 2 <= samples.length && size < 16384) size *= 2
  if (size < 1024) return null
  const { frequencyHz, levelDb } = magnitudeSpectrum(samples, sampleRate, samples.length - size, size)
  const binHz = sampleRate / size
  const lo = Math.max(1, Math.ceil(lowHz / binHz) - 1)
  const hi = Math.min(levelDb.length - 2, Math.floor(highHz / binHz) - 1)
  let best = -1
  for (let i = lo; i <= hi; i++) if (best < 0 || levelDb[i]! > levelDb[best]!) best = i
  if (best < 1) return null
  const v = parabolicPeak(levelDb[best - 1]!, levelDb[best]!, levelDb[best + 1]!)
  return { frequencyHz: frequencyHz[best]! + v.offset * binHz, levelDb: v.value }
}
