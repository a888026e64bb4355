/**
 * Unit conversions the engine shares, written once.
 * A frequency ratio r is 1200·log₂ r cents = (1200 / ln 2)·ln r: cents per neper of frequency.
 */
export const CENTS_PER_LOG = 1200 / Math.LN2

/** An amplitude ratio e^{−α} is 20·log₁₀ e^{−α} dB: dB per neper of amplitude (≈ 8.686). */
export const DB_PER_NEPER = 20 / Math.LN10

/** Length of the 1 ms energy blocks the strike is found with, in samples (at least 16, so a low rate still averages). */
export function energyBlockLength(sampleRate: number, blockS = 0.001): number {
  return Math.max(16, Math.round(sampleRate * blockS))
}
