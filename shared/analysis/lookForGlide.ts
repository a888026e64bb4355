import { MAIN_LOBE_BINS } from './chooseWindow'
import { ENGINE_SETTINGS as S } from './engineSettings'
import { findPitchGlide, loudestPeak, type PitchGlide } from './findPitchGlide'
import type { StrikeSpan } from './findStrike'
import { nextPowerOfTwo } from './nextPowerOfTwo'
import { shortTimePeaks, type SpectrumFrame } from './shortTimePeaks'

/** The look for a glide: a window short enough to follow a drum's glide, long enough to hold 60 Hz clear of 0 Hz, s. */
const GLIDE_WINDOW_S = 0.08
/** Frames per window (a glide of a few semitones in 0.1 s moves under 150 cents a frame). */
const GLIDE_FRAMES_PER_WINDOW = 4
/** A reading whose frames spread more than this about it (RMS, cents) may be a glide the long frames step over. */
const UNSTEADY_CENTS = 20
/** How long after the strike it looks, s. */
const GLIDE_LOOK_S = 1.5

/**
 * Where the strike's loudest sound glides in pitch (findPitchGlide), or null.
 * The long window's frames are first asked: when its loudest peak is reported, its reading's
 * frames spread no more than 20 ¢ (a struck bar's or bell's loudest partial mostly spreads a few
 * cents; where more, the second look costs a few ms and findPitchGlide decides) and the long
 * frames show no glide, nothing more is done; otherwise the first 1.5 s are looked at again with
 * a 0.08 s window, which follows a glide the long window's frames step over.
 */
export function lookForGlide(
  mono: Float64Array,
  sampleRate: number,
  strike: StrikeSpan,
  long: { frames: readonly SpectrumFrame[], windowS: number },
  reported: readonly { frequencyHz: number, stabilityCents: number }[],
  /** Frequencies the analysis covers, Hz (planAnalysis). */
  range: { minHz: number, maxHz: number },
): PitchGlide | null {
  const loudest = loudestPeak(long.frames)?.peak
  if (!loudest) return null
  const reachHz = MAIN_LOBE_BINS / 2 / long.windowS
  const held = reported.find(p => Math.abs(p.frequencyHz - loudest.frequencyHz) <= reachHz)
  if (held && held.stabilityCents <= UNSTEADY_CENTS && !findPitchGlide(long.frames)) return null
  const windowLength = Math.round(GLIDE_WINDOW_S * sampleRate)
  const endIndex = Math.min(strike.endIndex, strike.startIndex + Math.round(GLIDE_LOOK_S * sampleRate))
  if (endIndex - strike.startIndex < 2 * windowLength) return null
  const frames = shortTimePeaks(mono, sampleRate, {
    windowLength,
    fftSize: nextPowerOfTwo(2 * windowLength),
    hop: Math.round(windowLength / GLIDE_FRAMES_PER_WINDOW),
    startIndex: strike.startIndex,
    endIndex,
    peakThresholdDb: S.peakThresholdDb,
    noiseMarginDb: S.noiseMarginDb,
    minFrequencyHz: range.minHz,
    maxFrequencyHz: range.maxHz,
  })
  return findPitchGlide(frames)
}
