import { ENGINE_SETTINGS as S } from './engineSettings'
import type { StrikeSpan } from './findStrike'
import { findLongLookPartials } from './findLongLookPartials'
import { longSpectrumPeaks } from './longSpectrumPeaks'
import type { AnalysisPlan } from './planAnalysis'
import type { MeasuredPartial } from './types'

/** The partials with the long look's added, and a warning naming them. */
export interface WithLongLookPartials {
  /** By ascending frequency. */
  partials: MeasuredPartial[]
  warnings: string[]
}

/** Longest long look, s: a low partial's neighbour 2 Hz away is resolved (one main lobe of a Blackman–Harris window is 8 / T Hz). */
const MAX_LOOK_S = 1
/** The look must be this many times the slowest band's window, or it resolves nothing the bands did not. */
const MIN_GAIN = 2
/** Peaks looked at: within this of the strongest, and over the noise by the bands' margin, dB. */
const BELOW_STRONGEST_DB = 30
/**
 * The spectrum's peaks are listed further down and nearer the floor than that, so that a
 * candidate's weaker neighbours (which broke up its track) and sideband mirrors are seen, dB.
 */
const NEIGHBOURS_BELOW_STRONGEST_DB = 50
const NEIGHBOURS_NOISE_MARGIN_DB = 10

/**
 * The long look: one Blackman–Harris spectrum over as long as the strike rings (up to 1 s),
 * after the bands are measured, for strong partials close to a neighbour that the bands'
 * shorter windows folded into one lobe (findLongLookPartials). Skipped when there are no
 * partials to compare with or the strike is too short to resolve more than the bands did.
 */
export function addLongLookPartials(
  mono: Float64Array,
  sampleRate: number,
  partials: readonly MeasuredPartial[],
  strike: StrikeSpan,
  plan: AnalysisPlan,
  level: { peakDb: number, minAmplitudeDb: number },
): WithLongLookPartials {
  const bandWindowS = plan.bands[0]?.windowS ?? Infinity
  const length = Math.min(Math.round(MAX_LOOK_S * sampleRate), strike.endIndex - strike.startIndex)
  if (partials.length === 0 || length < MIN_GAIN * bandWindowS * sampleRate) return { partials: [...partials], warnings: [] }
  const peaks = longSpectrumPeaks(mono, sampleRate, {
    startIndex: strike.startIndex,
    length,
    minFrequencyHz: plan.range.minHz,
    maxFrequencyHz: plan.range.maxHz,
    belowStrongestDb: NEIGHBOURS_BELOW_STRONGEST_DB,
    noiseMarginDb: NEIGHBOURS_NOISE_MARGIN_DB,
  })
  const found = findLongLookPartials(mono, sampleRate, peaks, partials, {
    startIndex: strike.startIndex,
    length,
    onsetIndex: strike.onsetIndex,
    bandWindowS,
    maxAmplitudeDb: level.peakDb + S.peakMarginDb,
    minAmplitudeDb: level.minAmplitudeDb,
    minDecayDbPerS: S.spurious.steadyDecayDbPerS,
    maxDecayDbPerS: S.maxDecayDbPerS,
    maxModulationHz: 2 * S.modulation.maxRateHz,
    belowStrongestDb: BELOW_STRONGEST_DB,
    noiseMarginDb: S.noiseMarginDb,
  })
  const warnings = found.length === 0
    ? []
    : [`${found.map(p => `${p.frequencyHz.toFixed(2)} Hz`).join(', ')}: close to a neighbour the short-time windows could not separate; measured over ${(length / sampleRate).toFixed(2)} s by the high-resolution estimator`]
  return { partials: [...partials, ...found].sort((a, b) => a.frequencyHz - b.frequencyHz), warnings }
}
