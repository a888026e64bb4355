import { decimateBand, type DecimatedBand } from './decimateBand'
import { inputBand } from './inputBand'
import { nextPowerOfTwo } from './nextPowerOfTwo'
import { realFft } from './realFft'

/**
 * A band holding `frequencyHz ± halfWidthHz` with all the band's edge margin, decimated
 * by at most `maxFactor`, with a sample at input sample `alignIndex`, for a span of
 * `spanLength` input samples; the same band object for every track that asks for it.
 */
export type BandSource = (frequencyHz: number, halfWidthHz: number, maxFactor: number, alignIndex?: number, spanLength?: number) => DecimatedBand

/** Bands kept at once (neighbouring tracks are measured one after another; a band is ≤ a few hundred kB). */
const DEFAULT_KEPT = 24
/** A band decimated less than this costs more to make than it saves: the input itself serves instead. */
const MIN_FACTOR = 16
/** Passes over its span a track's measurement makes, about (refinement steps, sidebands, pair search). */
const PASSES_PER_SPAN = 6

/**
 * Decimated bands of one signal for one analysis, made on demand from a single DFT of the
 * whole signal (taken at the first request) by decimateBand, and kept while they are in
 * use. A band is `bins` wide (a power of two, so bins·fs/N Hz) with its centre on a grid of
 * bins/4: the requested frequency then lies within an eighth of the width of the centre,
 * and the band covers it ± (3/8 of its width) — which is made at least `halfWidthHz`. Where
 * that would leave a factor under 16, the band is the input itself (factor 1, centre 0 Hz) —
 * and so it is until the tracks served at the input's rate have cost about what the DFT costs
 * (N·log₂N sample operations; rent before buying): a strike of a few partials never pays for it.
 */
export function bandSource(signal: Float64Array, sampleRate: number, kept = DEFAULT_KEPT): BandSource {
  if (!(sampleRate > 0) || signal.length < 2) throw new RangeError('bandSource needs a signal and a positive sample rate')
  const fftSize = nextPowerOfTwo(signal.length)
  const binHz = sampleRate / fftSize
  const id = ++sources
  let transformed = false
  let own: Float64Array | null = null
  let full: DecimatedBand | null = null
  let spentAtInputRate = 0
  const transformCost = fftSize * Math.log2(fftSize)
  const cache = new Map<string, DecimatedBand>()
  return (frequencyHz, halfWidthHz, maxFactor, alignIndex = 0, spanLength = 0) => {
    if (!(frequencyHz >= 0 && halfWidthHz > 0 && maxFactor >= 1)) throw new RangeError('bandSource needs a frequency, a positive half-width and a factor of at least 1')
    const bins = nextPowerOfTwo(Math.max(16, Math.ceil((8 * halfWidthHz) / (3 * binHz)), Math.ceil(fftSize / maxFactor)))
    if (bins > fftSize / MIN_FACTOR || (!transformed && spentAtInputRate < transformCost)) {
      spentAtInputRate += PASSES_PER_SPAN * spanLength
      full ??= inputBand(signal, sampleRate)
      return full
    }
    const spectrum = fftSize > MAX_SHARED_SIZE ? (own ??= realFft(padded(signal, fftSize, new Float64Array(fftSize)))) : sharedSpectrum(id, signal, fftSize)
    transformed = true
    const grid = Math.max(1, bins / 4)
    const centreBin = Math.round(frequencyHz / binHz / grid) * grid
    const firstIndex = alignIndex % (fftSize / bins)
    const key = `${bins}:${centreBin}:${firstIndex}`
    let band = cache.get(key)
    if (band) cache.delete(key)
    else band = decimateBand(spectrum, fftSize, sampleRate, centreBin, bins, firstIndex)
    cache.set(key, band)
    if (cache.size > kept) cache.delete(cache.keys().next().value!)
    return band
  }
}

/** Largest transform whose buffers are kept between analyses (2¹⁹ points: 11 s at 48 kHz, 12 MB). */
const MAX_SHARED_SIZE = 2 ** 19
/**
 * The whole-signal transform's buffers, shared by the sources of one thread (fresh 4 MB arrays
 * for every analysis cost more than the transform): the last source to transform owns them,
 * and a source that finds them taken transforms again, so no source ever reads another's spectrum.
 */
const shared = { owner: 0, padded: new Float64Array(0), spectrum: new Float64Array(0) }
let sources = 0

/** The DFT of `signal` zero-padded to `fftSize`, in the shared buffers (taken over if another source holds them). */
function sharedSpectrum(id: number, signal: Float64Array, fftSize: number): Float64Array {
  if (shared.owner === id) return shared.spectrum
  if (shared.padded.length !== fftSize) {
    shared.padded = new Float64Array(fftSize)
    shared.spectrum = new Float64Array(2 * fftSize)
  }
  realFft(padded(signal, fftSize, shared.padded), shared.spectrum)
  shared.owner = id
  return shared.spectrum
}

/** `signal` followed by zeros, in `out` (fftSize long). */
function padded(signal: Float64Array, fftSize: number, out: Float64Array): Float64Array {
  out.set(signal)
  out.fill(0, signal.length, fftSize)
  return out
}
