import { nextPowerOfTwo } from './nextPowerOfTwo'
import { fftPlan, realFft } from './realFft'

/**
 * The dot products of a short signal with every stretch of a longer one,
 * out[m] = Σᵢ a[i]·b[i + m] for m = 0 … b.length − a.length (a cross-correlation over the lags
 * where `a` lies wholly inside `b`), by the FFT: the inverse transform of conj(A)·B, with both
 * zero-padded to a power of two ≥ b.length so no lag wraps round (fast correlation; e.g.
 * Oppenheim & Schafer, Discrete-Time Signal Processing, 3rd ed., §8.7).
 */
export function slidingDotProducts(a: Float64Array, b: Float64Array): Float64Array {
  if (a.length === 0 || b.length < a.length) throw new RangeError('slidingDotProducts needs a non-empty signal no longer than the one it slides along')
  const size = Math.max(2, nextPowerOfTwo(b.length))
  const padded = (x: Float64Array) => {
    const out = new Float64Array(size)
    out.set(x)
    return out
  }
  const spectrumA = realFft(padded(a))
  const spectrumB = realFft(padded(b))
  // conj(A)·B for bins 0 … N/2; the upper half mirrors it (both signals are real).
  const product = new Float64Array(2 * size)
  for (let k = 0; k <= size / 2; k++) {
    const [ar, ai, br, bi] = [spectrumA[2 * k]!, spectrumA[2 * k + 1]!, spectrumB[2 * k]!, spectrumB[2 * k + 1]!]
    const re = ar * br + ai * bi
    const im = ar * bi - ai * br
    product[2 * k] = re
    product[2 * k + 1] = im
    if (k > 0 && k < size / 2) {
      product[2 * (size - k)] = re
      product[2 * (size - k) + 1] = -im
    }
  }
  const inverse = new Float64Array(2 * size)
  fftPlan(size).inverseTransform(inverse, product)
  const out = new Float64Array(b.length - a.length + 1)
  for (let m = 0; m < out.length; m++) out[m] = inverse[2 * m]!
  return out
}
