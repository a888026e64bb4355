import { MIN_ZERO_PAD, windowLayout } from './windowLayout'

/** Null-to-null main-lobe width of the 4-term Blackman–Harris window, in bins (Harris 1978). */
export const MAIN_LOBE_BINS = 8

/** A window's main lobe is this much narrower than the spacing or the lowest partial it must resolve. */
const LOBE_MARGIN = 1.25
/**
 * The longest window's zero padding at the least, when that window is shorter than
 * FINE_GRID_BELOW_S (twice windowLayout's default): such a window was cut short by the span or
 * chosen for a low partial, whose track lies within a few main lobes of 0 Hz and of its
 * neighbours, and whose frames also judge whether it is one steady partial (stabilityCents):
 * on the coarser grid a tabla stroke's 0.106 s window (at 44.1 and 48 kHz) lost every track.
 */
const LONG_WINDOW_ZERO_PAD = 2
/**
 * From this window length on, the longest window takes windowLayout's default padding: its main
 * lobe (under 32 Hz) spans 10 bins or more, and its frames read as well (the 21 recordings' p90
 * against the manual reading 2.19 → 1.93 ¢, the 87-strike sweep's counts unchanged at 44.1, 48
 * and 96 kHz) with half the transform (a 0.5 s window at 48 kHz: 32 768 points, not 65 536).
 */
const FINE_GRID_BELOW_S = 0.25
/** The longest window is this fraction of the span (frames enough for a decay fit). */
const WINDOWS_PER_SPAN = 3

/**
 * Span after the strike, s, over which chooseWindow's longest window tells a partial at
 * `frequencyHz` from 0 Hz (a whole main lobe, with the margin, between them).
 */
export function spanNeededS(frequencyHz: number): number {
  if (!(frequencyHz > 0)) throw new RangeError('spanNeededS needs a positive frequency')
  return (WINDOWS_PER_SPAN * LOBE_MARGIN * MAIN_LOBE_BINS) / frequencyHz
}

/** Analysis window and frame layout, in samples and in seconds. */
export interface WindowChoice {
  windowLength: number
  fftSize: number
  hop: number
  windowS: number
  hopS: number
  /** fftSize / windowLength (≥ 1.25, windowLayout; ≥ 2 for a longest window under 0.25 s, chooseWindow). */
  zeroPad: number
}

export interface WindowNeeds {
  /** Smallest spacing between partials that must be resolved, in Hz. */
  spacingHz: number
  /** Lowest partial expected, in Hz (it must clear its mirror image at −f). */
  lowestHz: number
  /** Length of the analysed span, in s. */
  spanS: number
  /** A forced window length in s (overrides the derivation). */
  windowS?: number
}

/**
 * Window length from the partials to resolve: a window of T seconds has a main lobe
 * MAIN_LOBE_BINS / T Hz wide, which must be narrower than the closest spacing and than
 * the lowest partial itself (a whole lobe between it and DC, so its mirror image at −f,
 * a DC step or rumble cannot lean on it), with a 25 % margin.
 * Kept between max(30 ms, span / 100) and min(0.5 s, span / 3) so a track has frames
 * enough for a decay fit; closer partials than that are found later by the long-window
 * refinement. FFT zero-padded to the next power of two ≥ 2 × the window (≥ 1.25 × from 0.25 s on); hop T / 4, but
 * never more than ~100 frames over the span (the decay fit needs no more, and speed
 * matters) — the hop is therefore at most one window.
 */
export function chooseWindow(needs: WindowNeeds, sampleRate: number): WindowChoice {
  if (!(sampleRate > 0) || !(needs.spanS > 0)) throw new RangeError('chooseWindow needs a positive rate and span')
  const needed = Math.max(
    (LOBE_MARGIN * MAIN_LOBE_BINS) / needs.spacingHz,
    (LOBE_MARGIN * MAIN_LOBE_BINS) / needs.lowestHz,
    0.03,
  )
  const longest = Math.min(0.5, needs.spanS / WINDOWS_PER_SPAN)
  // Never shorter than the hop (span / 100), so consecutive frames always overlap or touch.
  const windowS = needs.windowS ?? Math.min(Math.max(needed, needs.spanS / 100), longest)
  const windowLength = Math.max(64, Math.min(Math.round(windowS * sampleRate), Math.floor(needs.spanS * sampleRate)))
  const hop = Math.max(1, Math.round(Math.max(windowLength / 4, (needs.spanS * sampleRate) / 100)))
  const windowLengthS = windowLength / sampleRate
  return windowLayout(windowLength, hop, sampleRate, windowLengthS < FINE_GRID_BELOW_S ? LONG_WINDOW_ZERO_PAD : MIN_ZERO_PAD)
}
