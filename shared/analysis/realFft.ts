import FFT from 'fft.js'
import { twiddleTable } from './twiddleTable'

const plans = new Map<number, FFT>()

/**
 * An fft.js 4.0.4 plan of `size` with its tables in typed arrays: the fields its constructor
 * sets (the package is pinned; realFft.test.ts checks the transforms bit for bit against a
 * plan the constructor built). Its constructor takes the cosines one by one into a plain
 * array, which costs a cold process more than the transforms it serves.
 */
function newPlan(size: number): FFT {
  let power = 0
  while (1 << power < size) power++
  // Radix-4 steps from a first step of width 8 (an even power) or 4 (an odd one), as fft.js does.
  const width = power % 2 === 0 ? power - 1 : power
  const bitrev = new Int32Array(1 << width)
  for (let j = 0; j < bitrev.length; j++) {
    for (let shift = 0; shift < width; shift += 2) bitrev[j]! |= ((j >>> shift) & 3) << (width - shift - 2)
  }
  const fields = { size, _csize: size << 1, table: twiddleTable(size), _width: width, _bitrev: bitrev, _out: null, _data: null, _inv: 0 }
  return Object.assign(Object.create(FFT.prototype) as FFT, fields)
}

/** One fft.js plan per size; building the twiddle table costs more than a transform. */
export function fftPlan(size: number): FFT {
  let plan = plans.get(size)
  if (!plan) {
    plan = newPlan(size)
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
