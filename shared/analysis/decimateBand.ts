import type { ComplexSignal } from './mixDownBand'
import { fftPlan } from './realFft'

/** A complex signal at baseband: sample j is at time j / sampleRateHz, and an input frequency f sits at f − centerHz. */
export interface Baseband extends ComplexSignal {
  sampleRateHz: number
  centerHz: number
  /** Length of the window the samples were taken under, in s, when it is not count / rate (its bins are 1 / durationS). */
  durationS?: number
  /** `im` is all zeros: a real signal (the input itself), whose DTFT the cheaper real recurrence gives. */
  real?: boolean
}

/** One band of a real signal, mixed down and decimated; sample j stands for input sample firstIndex + j·factor. */
export interface DecimatedBand extends Baseband {
  factor: number
  firstIndex: number
}

/**
 * The band of `bins` DFT bins around `centreBin` of a real signal, mixed down to 0 Hz and
 * decimated by fftSize / bins, from the signal's whole DFT (`spectrum`, realFft's bins
 * 0…N/2, N = `fftSize`): the band's bins, moved to 0 and inverse-transformed at size
 * `bins`, are the band-limited signal z[n] = x_band[n]·e^{−2πi·centreBin·n/N} at
 * n = firstIndex + j·N/bins (bin q turned by e^{2πiq·firstIndex/N} first) — the DFT's decimation identity (Oppenheim & Schafer, Discrete-Time Signal
 * Processing, 3rd ed., §8.4 sampling the DTFT, §4.6 downsampling). A brick-wall band in the DFT
 * has no delay and no passband ripple, and nothing outside the band folds into it; a
 * window's DTFT of z at offset ν equals the input's windowed DTFT at centre + ν, up to the
 * window's sidelobes at the band's edges.
 */
export function decimateBand(spectrum: Float64Array, fftSize: number, sampleRate: number, centreBin: number, bins: number, firstIndex = 0): DecimatedBand {
  if (!(fftSize >= 2 && (fftSize & (fftSize - 1)) === 0 && spectrum.length >= fftSize + 2)) throw new RangeError('decimateBand needs the realFft spectrum of a power-of-two length')
  if (!(bins >= 2 && bins <= fftSize && (bins & (bins - 1)) === 0)) throw new RangeError('decimateBand needs a power-of-two band no wider than the transform')
  if (!Number.isInteger(centreBin) || !Number.isInteger(firstIndex)) throw new RangeError('decimateBand needs a whole centre bin and first index')
  const half = bins / 2
  // fft.js divides the inverse by its size; the band's samples want 1/N.
  const scale = bins / fftSize
  const { data, out } = scratchFor(bins)
  // e^{2πiq·firstIndex/N} by a rotation recurrence from q = −half, re-seeded every 1024 bins.
  const turn = (2 * Math.PI * (firstIndex % fftSize)) / fftSize
  const cosTurn = Math.cos(turn)
  const sinTurn = Math.sin(turn)
  let c = 1
  let sn = 0
  for (let q = -half; q < half; q++) {
    if (((q + half) & 1023) === 0) {
      c = Math.cos(turn * q)
      sn = Math.sin(turn * q)
    }
    let k = centreBin + q
    if (k < 0 || k >= fftSize) k = ((k % fftSize) + fftSize) % fftSize
    let sign = 1
    // Bins above N/2 (and negative ones) are the conjugates of their mirrors: the input is real.
    if (k > fftSize / 2) {
      k = fftSize - k
      sign = -1
    }
    const slot = q < 0 ? q + bins : q
    const xRe = spectrum[2 * k]! * scale
    const xIm = sign * spectrum[2 * k + 1]! * scale
    data[2 * slot] = xRe * c - xIm * sn
    data[2 * slot + 1] = xRe * sn + xIm * c
    const next = c * cosTurn - sn * sinTurn
    sn = sn * cosTurn + c * sinTurn
    c = next
  }
  fftPlan(bins).inverseTransform(out, data)
  const re = new Float64Array(bins)
  const im = new Float64Array(bins)
  for (let j = 0; j < bins; j++) {
    re[j] = out[2 * j]!
    im[j] = out[2 * j + 1]!
  }
  return { re, im, sampleRateHz: (sampleRate * bins) / fftSize, centerHz: (centreBin * sampleRate) / fftSize, factor: fftSize / bins, firstIndex }
}

/** The inverse transform's input and output, reused: every slot is written before it is read. */
let scratch = new Float64Array(0)

function scratchFor(bins: number): { data: Float64Array, out: Float64Array } {
  if (scratch.length < 4 * bins) scratch = new Float64Array(4 * bins)
  return { data: scratch.subarray(0, 2 * bins), out: scratch.subarray(2 * bins, 4 * bins) }
}
