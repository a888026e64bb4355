import { centsBetween } from './centsBetween'
import { measureShortPartial } from './measureShortPartial'
import { pencilPartial } from './pencilPartial'
import type { MeasuredPartial } from './types'

/** A template partial the measurement should hold: its label, target and search window. */
export interface ExpectedPartial {
  label: string
  targetHz: number
  windowCents: number
}

export interface ShortSearchSettings {
  /** First sample after the attack, one past the last usable sample, and the onset (amplitudes refer to it). */
  startIndex: number
  endIndex: number
  onsetIndex: number
  /** Bounds of a believable amplitude, dB re full scale: the file's peak (plus margin) and the reported range's floor. */
  maxAmplitudeDb: number
  minAmplitudeDb: number
  /** Fastest believable decay, dB/s. */
  maxDecayDbPerS: number
  /** Span measured after the attack, s (default 0.04). */
  spanS?: number
}

/** Short-lived partials found, and a warning line for each. */
export interface ShortPartials {
  partials: MeasuredPartial[]
  warnings: string[]
}

/** A component must stand this far over the band's noise, dB. */
const MIN_SNR_DB = 20

/**
 * Template partials the FFT tracks missed (nothing reported inside their search window),
 * looked for by the matrix pencil in the first tens of milliseconds after the attack
 * (measureShortPartial), where a partial of T60 0.1 s is still strong but an STFT track is
 * only a few frames long (searched ±3 / span at most). One is reported when it stands ≥ 20 dB over the band's noise, lies
 * inside the window, decays no faster than a click and no louder than the file allows.
 */
export function findShortPartials(
  signal: Float64Array,
  sampleRate: number,
  partials: readonly MeasuredPartial[],
  expected: readonly ExpectedPartial[],
  settings: ShortSearchSettings,
): ShortPartials {
  const spanS = settings.spanS ?? 0.04
  const { startIndex } = settings
  const endIndex = Math.min(settings.endIndex, signal.length)
  if (!(startIndex >= 0 && startIndex < endIndex)) throw new RangeError('findShortPartials needs a span inside the signal')
  const found: MeasuredPartial[] = []
  const warnings: string[] = []
  for (const e of expected) {
    if (!(e.targetHz > 20 && e.targetHz < 0.45 * sampleRate)) continue
    const inWindow = (f: number) => Math.abs(centsBetween(f, e.targetHz)) <= e.windowCents
    if (partials.some(p => inWindow(p.frequencyHz)) || found.some(p => inWindow(p.frequencyHz))) continue
    // The band is twice the search wide: past ±3 / span it lets in too much of strong neighbours over so short a span.
    const searchHz = Math.min(e.targetHz * (2 ** (e.windowCents / 1200) - 1), 3 / spanS)
    const short = measureShortPartial(signal, sampleRate, e.targetHz, { startIndex, endIndex, spanS, searchHz, referenceIndex: settings.onsetIndex })
    if (!short || short.snrDb < MIN_SNR_DB || !inWindow(short.frequencyHz)) continue
    if (!(short.decayDbPerS >= 0 && short.decayDbPerS <= settings.maxDecayDbPerS)) continue
    if (!(short.amplitudeDb <= settings.maxAmplitudeDb && short.amplitudeDb >= settings.minAmplitudeDb)) continue
    const endS = startIndex / sampleRate + short.spanS
    found.push(pencilPartial(
      { frequencyHz: short.frequencyHz, decayDbPerS: short.decayDbPerS, amplitude: 10 ** (short.amplitudeDb / 20), phaseRad: 0, frequencySdHz: short.frequencySdHz, decaySdDbPerS: short.decaySdDbPerS, snrDb: short.snrDb },
      { startS: startIndex / sampleRate, endS },
    ))
    warnings.push(`${e.label} (${short.frequencyHz.toFixed(2)} Hz) dies too fast for the spectral tracks: measured from the first ${Math.round(1000 * short.spanS)} ms after the attack`)
  }
  return { partials: found, warnings }
}
