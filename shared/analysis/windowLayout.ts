import type { WindowChoice } from './chooseWindow'
import { nextPowerOfTwo } from './nextPowerOfTwo'

/**
 * Zero padding at the least, by default: the Blackman–Harris main lobe then spans at least 10
 * bins, and the parabolic fit of a peak's dB magnitude (parabolicPeak) reads a lone sinusoid's
 * level within 0.013 dB and its frequency within 0.0016 of an unpadded bin, wherever it falls
 * between bins (0.0019 dB and 0.0004 bin at twice the window; computed with this code). The
 * frames feed the tracks and their decay lines; a partial's frequency comes from the long
 * refinement window, so more padding buys the frames nothing a lone partial needs.
 */
export const MIN_ZERO_PAD = 1.25

/**
 * The frame layout of a window of `windowLength` samples and a hop of `hop` samples: the FFT
 * zero-padded to the next power of two ≥ `minZeroPad` × the window, and both lengths in seconds.
 */
export function windowLayout(windowLength: number, hop: number, sampleRate: number, minZeroPad = MIN_ZERO_PAD): WindowChoice {
  if (!(Number.isInteger(windowLength) && windowLength >= 1 && Number.isInteger(hop) && hop >= 1)) {
    throw new RangeError('windowLayout needs a whole window length and hop of at least one sample')
  }
  if (!(sampleRate > 0)) throw new RangeError('windowLayout needs a positive sample rate')
  if (!(minZeroPad >= 1)) throw new RangeError('windowLayout needs a transform at least as long as the window')
  const fftSize = nextPowerOfTwo(Math.ceil(minZeroPad * windowLength))
  return {
    windowLength,
    fftSize,
    hop,
    windowS: windowLength / sampleRate,
    hopS: hop / sampleRate,
    zeroPad: fftSize / windowLength,
  }
}
