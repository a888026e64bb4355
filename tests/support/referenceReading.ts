// An independent plain reading of a recording's spectrum, used to check the engine's
// fixtures by hand: one Hann window (common practice) over up to `spanS` seconds from
// 10 ms after the first sample above a tenth of the peak, zero-padded eightfold, peaks
// located by parabolic interpolation of the dB magnitude (a three-point fit, common practice). It shares
// no code with shared/analysis beyond the FFT library (fft.js).
import FFT from 'fft.js'

export interface ReadingPeak {
  frequencyHz: number
  /** Peak amplitude of a steady sinusoid giving this magnitude, dB re full scale. */
  amplitudeDb: number
}

export function referenceReading(samples: Float64Array, sampleRate: number, spanS = 1, rangeDb = 60): ReadingPeak[] {
  let peak = 0
  for (const v of samples) peak = Math.max(peak, Math.abs(v))
  let onset = 0
  while (onset < samples.length && Math.abs(samples[onset]!) < 0.1 * peak) onset++
  const start = Math.min(samples.length - 1, onset + Math.round(0.01 * sampleRate))
  const length = Math.min(samples.length - start, Math.round(spanS * sampleRate))
  let size = 1
  while (size < 8 * length) size *= 2
  const input = new Float64Array(size)
  let windowSum = 0
  for (let n = 0; n < length; n++) {
    const w = 0.5 - 0.5 * Math.cos((2 * Math.PI * n) / length)
    windowSum += w
    input[n] = samples[start + n]! * w
  }
  const fft = new FFT(size)
  const out = fft.createComplexArray() as number[]
  fft.realTransform(out, Array.from(input))
  const db = new Float64Array(size / 2)
  for (let k = 0; k < size / 2; k++) db[k] = 10 * Math.log10(out[2 * k]! ** 2 + out[2 * k + 1]! ** 2 + 1e-30) + 20 * Math.log10(2 / windowSum)
  const binHz = sampleRate / size
  let top = -Infinity
  for (let k = Math.ceil(20 / binHz); k < size / 2 - 1; k++) top = Math.max(top, db[k]!)
  const peaks: ReadingPeak[] = []
  for (let k = Math.max(2, Math.ceil(20 / binHz)); k < size / 2 - 1; k++) {
    const c = db[k]!
    if (c < top - rangeDb || c <= db[k - 1]! || c < db[k + 1]!) continue
    const l = db[k - 1]!
    const r = db[k + 1]!
    const d = l - 2 * c + r
    const offset = d < 0 ? (0.5 * (l - r)) / d : 0
    peaks.push({ frequencyHz: (k + offset) * binHz, amplitudeDb: c - 0.25 * (l - r) * offset })
  }
  return peaks.sort((a, b) => b.amplitudeDb - a.amplitudeDb)
}
