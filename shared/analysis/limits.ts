/** Input limits of the engine (the contract). */
export const LIMITS = {
  maxBytes: 50 * 1024 * 1024,
  minDurationS: 0.2,
  maxDurationS: 60,
  minSampleRate: 8000,
  maxSampleRate: 192000,
  maxChannels: 8,
  /**
   * Longest the engine may measure one recording, s (workDeadline): a legitimate 60 s strike takes a
   * few seconds on a slow machine; a recording made to be slow (dense noise) must not hold a thread longer.
   */
  maxMeasureS: 20,
  /** Peak below this (about −120 dBFS) counts as digital silence. */
  silencePeak: 1e-6,
} as const
