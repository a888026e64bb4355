import { cachedLowPass } from './cachedLowPass'
import { phasorTable, type PhasorTable } from './phasorTable'

/** A complex-valued signal as two parallel arrays. */
export interface ComplexSignal {
  re: Float64Array
  im: Float64Array
}

/** One band of a recording, mixed down to 0 Hz and decimated. */
export interface BandSignal extends ComplexSignal {
  /** Sample rate of the band signal (input rate / factor), in Hz. */
  sampleRateHz: number
  /** Input frequency that now sits at 0 Hz. */
  centerHz: number
  /** Decimation factor. */
  factor: number
  /** Input sample index that band sample 0 stands for (the centre of its filter span). */
  firstIndex: number
  /** Low-pass taps used (odd length, symmetric, unit gain at 0 Hz; shared between calls, read only). */
  taps: Float64Array
  /** Input samples between two taps (1 here; a coarser band's factor where the filter ran on it: mixDownCoarse). */
  tapStep: number
}

export interface MixDownSettings {
  /** First and one-past-last input sample that may be used. */
  startIndex: number
  endIndex: number
  /** Decimation factor, ≥ 2. */
  factor: number
  /** Passband half-width as a fraction of the band's sample rate, in (0, ½) (default ⅛). */
  passbandFraction?: number
  /** Stopband attenuation of the low-pass filter in dB (default 50). */
  attenuationDb?: number
}

/**
 * Complex heterodyne, low-pass and decimation in one pass (a digital down-converter,
 * e.g. Lyons, Understanding Digital Signal Processing, 3rd ed., §8.9):
 * y[m] = e^{−iω_c t_m} Σ_j h[j] e^{−iω_c (j − c)} x[t_m − c + j], t_m = start + c + m·D,
 * with a Kaiser low-pass h of delay c whose passband (±p·fs/D) keeps the band and whose
 * stopband (from (1 − p)·fs/D) removes everything that would fold into it. A narrow
 * passband (small p) allows a wide transition, hence a short filter: less of the span is
 * lost at its two ends, where the filter does not fit. The filter is
 * evaluated only at the kept outputs, and only where it lies wholly inside the span, so a
 * damped exponential a·zⁿ comes out as the exact exponential a·H·(z e^{−iω_c})^{t_m}.
 */
export function mixDownBand(signal: Float64Array, sampleRate: number, centerHz: number, settings: MixDownSettings): BandSignal {
  const { startIndex, endIndex, factor } = settings
  if (!(sampleRate > 0)) throw new RangeError('mixDownBand needs a positive sample rate')
  if (!(centerHz >= 0 && centerHz < sampleRate / 2)) throw new RangeError('mixDownBand needs a centre frequency between 0 Hz and half the sample rate')
  if (!Number.isInteger(factor) || factor < 2) throw new RangeError('mixDownBand needs a whole decimation factor of at least 2')
  if (!(startIndex >= 0 && endIndex <= signal.length && startIndex < endIndex)) throw new RangeError('mixDownBand needs a span inside the signal')
  const passband = settings.passbandFraction ?? 1 / 8
  if (!(passband > 0 && passband < 0.5)) throw new RangeError('mixDownBand needs a passband fraction between 0 and ½')
  const taps = cachedLowPass(factor, passband, settings.attenuationDb ?? 50)
  const length = taps.length
  const delay = (length - 1) / 2
  const count = Math.max(0, Math.floor((endIndex - startIndex - length) / factor) + 1)
  const omega = (2 * Math.PI * centerHz) / sampleRate
  // Band-pass taps, folded: the low-pass moved up to the band, phase referenced to the
  // centre tap, g[c ± k] = h[c + k]·e^{∓iωk}; the pair x[c+k], x[c−k] then costs two
  // multiplications instead of four: Re += h cos ωk·(x₊ + x₋), Im += h sin ωk·(x₋ − x₊);
  // e^{iωk} by a rotation recurrence (phasorTable).
  if (folded.cos.length < delay + 1) folded = { cos: new Float64Array(delay + 1), sin: new Float64Array(delay + 1) }
  const { cos: hCos, sin: hSin } = phasorTable(omega, delay + 1, folded)
  for (let k = 0; k <= delay; k++) {
    hCos[k]! *= taps[delay + k]!
    hSin[k]! *= taps[delay + k]!
  }
  const re = new Float64Array(count)
  const im = new Float64Array(count)
  foldedFir(signal, startIndex, factor, delay, omega, hCos, hSin, re, im)
  return { re, im, sampleRateHz: sampleRate / factor, centerHz, factor, firstIndex: startIndex + delay, taps, tapStep: 1 }
}

/**
 * The filter at each kept output with its carrier mixed off, into `re`/`im` (a function of its
 * own: the loop is compiled whole, not entered mid-way).
 */
function foldedFir(signal: Float64Array, startIndex: number, factor: number, delay: number, omega: number, hCos: Float64Array, hSin: Float64Array, re: Float64Array, im: Float64Array): void {
  for (let m = 0; m < re.length; m++) {
    const base = startIndex + m * factor
    const centre = base + delay
    let sRe = hCos[0]! * signal[centre]!
    let sIm = 0
    let k = 1
    // Two taps a step (the same sums in the same order: the result is bit for bit the plain loop's).
    for (; k < delay; k += 2) {
      const after = signal[centre + k]!
      const before = signal[centre - k]!
      const after2 = signal[centre + k + 1]!
      const before2 = signal[centre - k - 1]!
      sRe += hCos[k]! * (after + before)
      sIm += hSin[k]! * (before - after)
      sRe += hCos[k + 1]! * (after2 + before2)
      sIm += hSin[k + 1]! * (before2 - after2)
    }
    if (k === delay) {
      sRe += hCos[k]! * (signal[centre + k]! + signal[centre - k]!)
      sIm += hSin[k]! * (signal[centre - k]! - signal[centre + k]!)
    }
    // Mix the output down by the phase of the carrier at the output's own time.
    const phase = -omega * (base + delay)
    const c = Math.cos(phase)
    const s = Math.sin(phase)
    re[m] = sRe * c - sIm * s
    im[m] = sRe * s + sIm * c
  }
}

/** The folded band-pass taps, reused from call to call (only the first delay + 1 are written and read). */
let folded: PhasorTable = { cos: new Float64Array(0), sin: new Float64Array(0) }
