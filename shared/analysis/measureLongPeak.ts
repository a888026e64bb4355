import { BLACKMAN_HARRIS_COEFFICIENTS } from './blackmanHarris'
import { centsBetween } from './centsBetween'
import { MAIN_LOBE_BINS } from './chooseWindow'
import { decayingWindowGain } from './decayingWindowGain'
import { basebandDtft } from './basebandDtft'
import { estimateBand } from './estimateBand'
import { fitLine } from './fitLine'
import { refinePeak } from './refinePeak'
import type { MeasuredPartial } from './types'
import type { Baseband, DecimatedBand } from './decimateBand'
import { windowBand } from './windowBand'
import { partialUncertaintyCents } from './partialUncertaintyCents'
import { CENTS_PER_LOG, DB_PER_NEPER } from './units'
import { partialUncertaintyDecayPct } from './partialUncertaintyDecayPct'
import { decayPullDbPerS, SPREAD_NOISE } from './decayPull'
import { componentEnergy } from './componentEnergy'

export interface LongPeakSpan {
  /** `signal[startIndex … startIndex + length)` times a Blackman–Harris window of that length (windowBand of `input`). */
  windowed: Baseband
  /** The input signal as a band of factor 1 (what bandSource gives at the input's rate). */
  input: DecimatedBand
  startIndex: number
  onsetIndex: number
  /** Half-width of the band the pencil reads, Hz (about half the way to the nearest other peak). */
  halfWidthHz: number
  /** Level of the peak and the banded floor under it in the long spectrum, dB re full scale (longSpectrumPeaks). */
  levelDb: number
  noiseFloorDb: number
}

/** Half-length windows the decay is read from, from the start to the end of the long one (offsets in long windows). */
const DECAY_FRAMES = [0, 0.125, 0.25, 0.375, 0.5]
/** Only frames this far over the floor enter the decay line, dB (as a track's frames do). */
const FIT_MARGIN_DB = 15

/**
 * One partial at a peak of a long spectrum, read as the FFT path reads a track: frequency and
 * magnitude by iterated parabolic refinement on the long window (refinePeak); decay by a line
 * through the levels at that frequency in five half-length Blackman–Harris windows spread over
 * the long one (a decaying sinusoid's level falls linearly in dB with the window's centre),
 * those standing 15 dB over the floor (the long spectrum's, +3 dB for half the length);
 * onset amplitude as the magnitude over the window's gain for that decay (decayingWindowGain).
 * The second reading is the matrix pencil's component within a quarter main lobe that carries most
 * energy over the window
 * (estimateBand; Hua & Sarkar 1990), with the usual uncertainties √(bound² + Δ²/2); the
 * frequency's also carries the decay readings' spread beyond their noise (decayPull), as every
 * FFT partial's does (annotatePartials).
 * Null when the pencil finds no component there (nothing confirms the peak) or fewer than
 * two frames stand over the floor.
 */
export function measureLongPeak(signal: Float64Array, sampleRate: number, frequencyHz: number, span: LongPeakSpan): MeasuredPartial | null {
  const { windowed, startIndex, onsetIndex } = span
  const length = windowed.re.length
  if (!(frequencyHz > 0 && frequencyHz < sampleRate / 2)) throw new RangeError('measureLongPeak needs a frequency inside the recording\'s band')
  if (!(length >= 64 && startIndex >= 0 && startIndex + length <= signal.length)) throw new RangeError('measureLongPeak needs a window inside the signal')
  const peak = refinePeak(windowed, frequencyHz)
  const band = estimateBand(signal, sampleRate, peak.frequencyHz, { startIndex, endIndex: startIndex + length, halfWidthHz: span.halfWidthHz, referenceIndex: onsetIndex })
  const reachHz = (MAIN_LOBE_BINS * sampleRate) / length / 4
  const near = band?.components.filter(c => Math.abs(c.frequencyHz - peak.frequencyHz) <= reachHz
    && Number.isFinite(c.decayDbPerS) && Number.isFinite(c.frequencySdHz)) ?? []
  if (near.length === 0) return null
  // Ranked by what each carries over the long window, not at the onset (a burst of the attack
  // extrapolates loud there), as annotatePartials ranks a track's components.
  const fromS = (startIndex - onsetIndex) / sampleRate
  const carried = (c: (typeof near)[number]) => componentEnergy(c, fromS, fromS + length / sampleRate)
  const second = near.reduce((a, b) => (carried(b) > carried(a) ? b : a))

  const half = Math.floor(length / 2)
  // |X| of a sinusoid of amplitude A is A·Σw/2, Σw = a₀·N for the periodic window; noise gains 3 dB on a sinusoid in half the length.
  const gainDb = 20 * Math.log10(2 / (BLACKMAN_HARRIS_COEFFICIENTS[0] * half))
  const minLevelDb = span.noiseFloorDb + 10 * Math.log10(length / half) + FIT_MARGIN_DB
  const times: number[] = []
  const levels: number[] = []
  for (const at of DECAY_FRAMES) {
    const start = startIndex + Math.round(at * length)
    const [x] = basebandDtft(windowBand(span.input, start, half), [peak.frequencyHz]) as [{ re: number, im: number }]
    const levelDb = 10 * Math.log10(x.re * x.re + x.im * x.im + Number.MIN_VALUE) + gainDb
    if (levelDb < minLevelDb) continue
    times.push((start + half / 2) / sampleRate)
    levels.push(levelDb)
  }
  if (times.length < 2) return null
  const fit = fitLine(times, levels)
  const decayDbPerS = -fit.slope
  const gain = decayingWindowGain(length, decayDbPerS / DB_PER_NEPER / sampleRate, startIndex - onsetIndex)
  const delta = centsBetween(second.frequencyHz, peak.frequencyHz)
  const boundCents = (CENTS_PER_LOG * second.frequencySdHz) / peak.frequencyHz
  const decayDelta = second.decayDbPerS - decayDbPerS
  // The decay readings' spread beyond their noise pulls the frequency too (decayPull), as in annotatePartials.
  const decayPull = decayPullDbPerS(decayDelta, second.decaySdDbPerS * SPREAD_NOISE)
  return {
    frequencyHz: peak.frequencyHz,
    amplitudeDb: 20 * Math.log10(Math.max((2 * peak.magnitude) / gain, 1e-12)),
    decayDbPerS,
    t60S: decayDbPerS > 0 ? 60 / decayDbPerS : null,
    r2: fit.r2,
    startS: startIndex / sampleRate,
    endS: (startIndex + length) / sampleRate,
    stabilityCents: boundCents,
    beatHz: null,
    snrDb: span.levelDb - span.noiseFloorDb,
    frames: times.length,
    modulationHz: null,
    modulationDepthDb: null,
    crossCheckCents: delta,
    uncertaintyCents: partialUncertaintyCents(boundCents, delta, peak.frequencyHz, decayDbPerS, decayPull),
    uncertaintyDecayPct: partialUncertaintyDecayPct(second.decaySdDbPerS, decayDelta, decayDbPerS),
  }
}
