/** Level checks of the raw channels. */
export interface LevelReport {
  /** Samples at or beyond full scale in any channel. */
  clippedSamples: number
  /** Largest absolute sample over all channels. */
  peak: number
  /** Non-finite samples (NaN or ±Infinity). */
  invalidSamples: number
}

/** A sample this close to full scale counts as clipped (the largest 16-bit code is 1 − 2⁻¹⁵). */
export const CLIP_LEVEL = 1 - 2 ** -14

/** Count clipped and invalid samples and find the peak, over every channel. */
export function inspectLevels(channels: readonly ArrayLike<number>[]): LevelReport {
  let clippedSamples = 0
  let invalidSamples = 0
  let peak = 0
  for (const channel of channels) {
    for (let i = 0; i < channel.length; i++) {
      const v = channel[i]!
      if (!Number.isFinite(v)) {
        invalidSamples++
        continue
      }
      const a = Math.abs(v)
      if (a > peak) peak = a
      if (a >= CLIP_LEVEL) clippedSamples++
    }
  }
  return { clippedSamples, peak, invalidSamples }
}
