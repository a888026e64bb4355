/** Under the quantisation noise's own estimate, undithered low-level audio still shows its error as lines. */
const DISTORTION_MARGIN_DB = 10

/**
 * The range of levels under the strongest partial that `bitsPerSample`-bit PCM can show as
 * partials, dB: the signal-to-quantisation-noise ratio of a full-scale sine, 6.02·N + 1.76 dB
 * (source: Bennett, "Spectra of quantized signals", Bell System Technical Journal 27, 1948;
 * the standard SQNR formula), less 10 dB because without dither the error is correlated with
 * the signal and gathers into harmonic lines above the noise (from memory). 8-bit audio gives
 * 39.9 dB; 16-bit 88 dB, more than the engine's 80 dB, so only coarse formats are limited.
 */
export function quantisationRangeDb(bitsPerSample: number): number {
  if (!(bitsPerSample > 0)) throw new RangeError('quantisationRangeDb needs a positive bit depth')
  return 6.02 * bitsPerSample + 1.76 - DISTORTION_MARGIN_DB
}
