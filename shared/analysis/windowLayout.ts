import type { WindowChoice } from './chooseWindow'
import { nextPowerOfTwo } from './nextPowerOfTwo'

/**
 * The frame layout of a window of `windowLength` samples and a hop of `hop` samples: the FFT
 * zero-padded to the next power of two ≥ 2 × the window (so the Blackman–Harris main lobe
 * spans at least 16 bins and the parabolic peak fit is close), and both lengths in seconds.
 */
export function windowLayout(windowLength: number, hop: number, sampleRate: number): WindowChoice {
  if (!(Number.isInteger(windowLength) && windowLength >= 1 && Number.isInteger(hop) && hop >= 1)) {
    throw new RangeError('windowLayout needs a whole window length and hop of at least one sample')
  }
  if (!(sampleRate > 0)) throw new RangeError('windowLayout needs a positive sample rate')
  const fftSize = nextPowerOfTwo(2 * windowLength)
  return {
    windowLength,
    fftSize,
    hop,
    windowS: windowLength / sampleRate,
    hopS: hop / sampleRate,
    zeroPad: fftSize / windowLength,
  }
}
