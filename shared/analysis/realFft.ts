import FFT from 'fft.js'

const plans = new Map<number, FFT>()

/** One fft.js plan per size; building the twiddle table costs more than a transform. */
export function fftPlan(size: number): FFT {
  let plan = plans.get(size)
  if (!plan) {
    plan = new FFT(size)
    plans.set(size, plan)
    // Keep the cache small: a few sizes are in use per analysis.
    if (plans.size > 16) plans.delete(plans.keys().next().value as number)
  }
  return plan
}

/**
 * Discrete Fourier transform X[k] = Σ x[n] e^{−2πikn/N} of a real signal of
 * power-of-two length N (radix-4 FFT by fft.js). Returns interleaved re/im for bins
 * 0…N/2 (the rest mirrors by conjugate symmetry). `out` may be passed to reuse memory.
 */
export function realFft(signal: Float64Array, out?: Float64Array): Float64Array {
  const size = signal.length
  if (size < 2 || (size & (size - 1)) !== 0) throw new RangeError('realFft needs a power-of-two length ≥ 2')
  const result = out && out.length >= 2 * size ? out : new Float64Array(2 * size)
  fftPlan(size).realTransform(result, signal)
  return result
}
