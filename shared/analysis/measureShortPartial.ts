import { estimateBand } from './estimateBand'

/** A short-lived partial measured from the first moments after the attack. */
export interface ShortPartial {
  frequencyHz: number
  decayDbPerS: number
  /** 60 / decayDbPerS, in s; null when not decaying. */
  t60S: number | null
  /** Peak amplitude at the reference sample, dB re full scale. */
  amplitudeDb: number
  /** One standard deviation of the frequency (Hz) and of the decay (dB/s), from the Cramér–Rao bound. */
  frequencySdHz: number
  decaySdDbPerS: number
  snrDb: number
  /** Span that was used, in s. */
  spanS: number
}

export interface ShortPartialSettings {
  /** First sample after the attack. */
  startIndex: number
  /** One past the last sample that may be used (default: end of the signal). */
  endIndex?: number
  /** Length analysed, in s (default 0.04). */
  spanS?: number
  /** How far the true frequency may lie from `frequencyHz`, in Hz (default 3 / spanS). */
  searchHz?: number
  /** Sample the amplitude refers to (default startIndex; pass the onset for the onset level). */
  referenceIndex?: number
}

/**
 * Measure a partial that dies within a fraction of a second (T60 down to 0.1 s, i.e. up to
 * 600 dB/s) from the first tens of milliseconds after the attack, where an FFT track is
 * only a few frames long: the matrix pencil on the band around `frequencyHz` (estimateBand),
 * wide enough for the partial's own line width (decay / (8.69·2π) Hz for decay in dB/s)
 * up to 600 dB/s. The strongest component within `searchHz` is returned, or null when the
 * span is too short or nothing stands over the noise there.
 */
export function measureShortPartial(signal: Float64Array, sampleRate: number, frequencyHz: number, settings: ShortPartialSettings): ShortPartial | null {
  const spanS = settings.spanS ?? 0.04
  if (!(spanS > 0)) throw new RangeError('measureShortPartial needs a positive span')
  if (!(frequencyHz > 0 && frequencyHz < sampleRate / 2)) throw new RangeError('measureShortPartial needs a frequency inside the recording\'s band')
  const startIndex = settings.startIndex
  const endIndex = Math.min(settings.endIndex ?? signal.length, startIndex + Math.round(spanS * sampleRate))
  if (!(startIndex >= 0 && endIndex > startIndex)) throw new RangeError('measureShortPartial needs a start inside the signal')
  const searchHz = settings.searchHz ?? 3 / spanS
  // Line width of a 600 dB/s partial: 600 / 8.69 / 2π ≈ 11 Hz; keep it well inside the passband.
  const halfWidthHz = Math.min(0.45 * frequencyHz, 0.45 * (sampleRate / 2 - frequencyHz), Math.max(2 * searchHz, 40))
  const band = estimateBand(signal, sampleRate, frequencyHz, {
    startIndex,
    endIndex,
    halfWidthHz,
    targetSamples: 48,
    maxOrder: 6,
    referenceIndex: settings.referenceIndex,
  })
  if (!band) return null
  const near = band.components.filter(c => Math.abs(c.frequencyHz - frequencyHz) <= searchHz && c.snrDb > 6)
  if (near.length === 0) return null
  const best = near.reduce((a, b) => (b.amplitude > a.amplitude ? b : a))
  return {
    frequencyHz: best.frequencyHz,
    decayDbPerS: best.decayDbPerS,
    t60S: best.decayDbPerS > 0 ? 60 / best.decayDbPerS : null,
    amplitudeDb: 20 * Math.log10(best.amplitude),
    frequencySdHz: best.frequencySdHz,
    decaySdDbPerS: best.decaySdDbPerS,
    snrDb: best.snrDb,
    spanS: band.spanS,
  }
}
