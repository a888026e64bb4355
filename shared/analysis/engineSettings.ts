/** Fixed settings of the engine (stored in every result's `parameters` where they shape it). */
export const ENGINE_SETTINGS = {
  attackSkipS: 0.005,
  peakThresholdDb: 80,
  /** Lossy codecs leave artefacts 40–60 dB under the partials: report less range. */
  lossyRangeDb: 35,
  noiseMarginDb: 20,
  /**
   * The noise floor of a frame may fall this far under its banded floor, to the lowest a later
   * frame showed (minimum statistics): a partial among a dense strike's skirts stands 20 dB over
   * the noise and 14 dB over the skirts around it. 6 dB, not more: at 10 dB the recordings
   * report up to three times as many weak peaks (38 instead of 12 on a timpani note) and no
   * tuned partial more.
   */
  maxFloorReliefDb: 6,
  fitMarginDb: 15,
  minSnrDb: 25,
  maxRefineS: 2,
  glideCentsPerS: 200,
  minJumpCents: 10,
  /** A strike must stand this far over the recording's quiet parts, in dB. */
  minProminenceDb: 10,
  /** Shortest span analysed after the onset, in s. */
  minSpanS: 0.1,
  /** Shortest window of the fast bands, in s (a partial of T60 0.1 s falls 5 dB in it). */
  shortestWindowS: 0.008,
  /** Each fast band's window is this many times shorter than the next slower one. */
  bandWindowRatio: 4,
  /** Frames of a fast band (hop a quarter window): they cover the partials' first moments. */
  fastBandFrames: 100,
  /** A partial falling more than this within one window of its band is measured in a faster band, dB. */
  maxDropPerWindowDb: 6,
  /** A track may pass through a modulation null this long (a 2 Hz tremolo's trough), s. */
  maxGapS: 0.2,
  /** Modulation rates looked for, Hz (tremolo and slow beating). */
  modulation: { minRateHz: 1.5, maxRateHz: 12, maxBelowCarrierDb: 30, maxImbalanceDb: 6 },
  /**
   * Not reported (dropSpuriousPartials): a line decaying slower than 2 dB/s with r² under 0.3,
   * 40 dB or more under the strongest partial; a reading 60 dB under it standing less than 30 dB over the noise.
   */
  spurious: { steadyBelowDb: 40, steadyDecayDbPerS: 2, steadyR2: 0.3, faintBelowDb: 60, faintMinSnrDb: 30 },
  /** Physical bounds: an amplitude this far over the file's peak is impossible, dB. */
  peakMarginDb: 1,
  /** A decay faster than this cannot be told from a click, dB/s (T60 10 ms). */
  maxDecayDbPerS: 6000,
  /** A partial growing faster than this is no partial of a strike, dB/s. */
  maxGrowthDbPerS: 1,
} as const
