import { cachedLowPass } from './cachedLowPass'
import type { DecimatedBand } from './decimateBand'
import type { BandSignal, MixDownSettings } from './mixDownBand'
import { phasorTable, type PhasorTable } from './phasorTable'

/**
 * What mixDownBand gives — the input mixed down to `centerHz`, low-passed (passband ±p of the
 * output rate, stopband from 1 − p of it) and decimated by `factor` — made from a coarser band of
 * the same input (`coarse`: decimateBand's brick-wall band, decimated by a factor F that divides
 * `factor`, with a sample at `startIndex`) at 1/F of the cost. The coarse samples are turned from
 * the coarse band's centre to `centerHz` and filtered by the same low-pass designed at the coarse
 * rate (factor / F taps per output step), so output m is Σ_j h[j]·w[t_m + (j − c)·F] with
 * w[n] = x_band[n]·e^{−iω_c n}: multirate decimation in two stages (Crochiere & Rabiner,
 * Multirate Digital Signal Processing, 1983, §5.3). The brick-wall stage only removes what the
 * low-pass would have attenuated anyway (50 dB), so a damped exponential still comes out as
 * a·H·(z e^{−iω_c})^{t_m}, with H the low-pass's gain at the pole over taps F input samples apart.
 * The coarse band must hold the low-pass's stopband edge around `centerHz`.
 */
export function mixDownCoarse(coarse: DecimatedBand, centerHz: number, settings: MixDownSettings): BandSignal {
  const { startIndex, endIndex, factor } = settings
  const step = coarse.factor
  if (!(Number.isInteger(step) && step >= 1 && Number.isInteger(factor) && factor % step === 0 && factor / step >= 2)) {
    throw new RangeError('mixDownCoarse needs a whole factor of at least twice the coarse band\'s, a multiple of it')
  }
  if (!(startIndex >= coarse.firstIndex && (startIndex - coarse.firstIndex) % step === 0 && startIndex < endIndex)) {
    throw new RangeError('mixDownCoarse needs a span that starts on one of the coarse band\'s samples')
  }
  const sampleRate = coarse.sampleRateHz * step
  const passband = settings.passbandFraction ?? 1 / 8
  if (!(passband > 0 && passband < 0.5)) throw new RangeError('mixDownCoarse needs a passband fraction between 0 and ½')
  const ratio = factor / step
  const taps = cachedLowPass(ratio, passband, settings.attenuationDb ?? 50)
  const length = taps.length
  const delay = (length - 1) / 2
  const first = (startIndex - coarse.firstIndex) / step
  // One past the last coarse sample before endIndex.
  const last = Math.min(coarse.re.length, Math.ceil((endIndex - coarse.firstIndex) / step))
  const count = Math.max(0, Math.floor((last - first - length) / ratio) + 1)
  const used = count === 0 ? 0 : (count - 1) * ratio + length
  // w[n] = z[n]·e^{−iΔn}, Δ = ω_c − ω_coarse per input sample, n = firstIndex + j·F (absolute time, as the coarse band's own mix).
  const turn = (2 * Math.PI * (centerHz - coarse.centerHz)) / sampleRate
  if (mixed.cos.length < used) mixed = { cos: new Float64Array(used), sin: new Float64Array(used) }
  const phasor = phasorTable(-turn * step, used, mixed)
  const start = -turn * (coarse.firstIndex + first * step)
  const c0 = Math.cos(start)
  const s0 = Math.sin(start)
  const re = new Float64Array(count)
  const im = new Float64Array(count)
  for (let m = 0; m < count; m++) {
    let sRe = 0
    let sIm = 0
    const base = m * ratio
    for (let j = 0; j < length; j++) {
      const k = base + j
      const zRe = coarse.re[first + k]!
      const zIm = coarse.im[first + k]!
      const pRe = phasor.cos[k]!
      const pIm = phasor.sin[k]!
      const h = taps[j]!
      sRe += h * (zRe * pRe - zIm * pIm)
      sIm += h * (zRe * pIm + zIm * pRe)
    }
    re[m] = sRe * c0 - sIm * s0
    im[m] = sRe * s0 + sIm * c0
  }
  return { re, im, sampleRateHz: sampleRate / factor, centerHz, factor, firstIndex: startIndex + delay * step, taps, tapStep: step }
}

/** The turning phasors, reused from call to call (only the first `used` are written and read). */
let mixed: PhasorTable = { cos: new Float64Array(0), sin: new Float64Array(0) }
