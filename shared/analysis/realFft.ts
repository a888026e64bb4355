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
 * power-of-two length N. Returns interleaved re/im for bins 0…N/2 (the rest mirrors by
 * conjugate symmetry). `out` may be passed to reuse memory.
 *
 * The real signal is read as N/2 complex samples z[n] = x[2n] + i·x[2n+1] (the same array,
 * interleaved), transformed at half the size (fft.js's radix-4 `transform`), and split:
 * X[k] = E[k] + W^k·O[k], X[N/2 − k] = conj(E[k] − W^k·O[k]), with E = (Z[k] + conj Z[N/2−k]) / 2,
 * O = −i·(Z[k] − conj Z[N/2−k]) / 2 and W = e^{−2πi/N} (the real-input FFT of Cooley, Lewis &
 * Welch 1970; e.g. Press et al., Numerical Recipes, 3rd ed., §12.3.2): about a quarter less
 * work than fft.js's own real transform.
 */
export function realFft(signal: Float64Array, out?: Float64Array): Float64Array {
  const size = signal.length
  if (size < 2 || (size & (size - 1)) !== 0) throw new RangeError('realFft needs a power-of-two length ≥ 2')
  const result = out && out.length >= 2 * size ? out : new Float64Array(2 * size)
  if (size < 8) {
    fftPlan(size).realTransform(result, signal)
    return result
  }
  const half = size / 2
  const { twiddles, spectrum } = splitFor(size)
  fftPlan(half).transform(spectrum, signal)
  splitHalves(spectrum, twiddles, half, result)
  return result
}

/** X[0…N/2] from the half-size transform Z (see realFft), into `result`. */
function splitHalves(spectrum: Float64Array, twiddles: Float64Array, half: number, result: Float64Array): void {
  const z0Re = spectrum[0]!
  const z0Im = spectrum[1]!
  result[0] = z0Re + z0Im
  result[1] = 0
  result[2 * half] = z0Re - z0Im
  result[2 * half + 1] = 0
  for (let k = 1; k <= half >> 1; k++) {
    const j = half - k
    const aRe = spectrum[2 * k]!
    const aIm = spectrum[2 * k + 1]!
    const bRe = spectrum[2 * j]!
    const bIm = spectrum[2 * j + 1]!
    const eRe = 0.5 * (aRe + bRe)
    const eIm = 0.5 * (aIm - bIm)
    const oRe = 0.5 * (aIm + bIm)
    const oIm = 0.5 * (bRe - aRe)
    const wRe = twiddles[2 * k]!
    const wIm = twiddles[2 * k + 1]!
    const tRe = wRe * oRe - wIm * oIm
    const tIm = wRe * oIm + wIm * oRe
    result[2 * k] = eRe + tRe
    result[2 * k + 1] = eIm + tIm
    result[2 * j] = eRe - tRe
    result[2 * j + 1] = tIm - eIm
  }
}

/** Per size: W^k = e^{−2πik/N} interleaved for k ≤ N/4 (twiddleTable's layout), and the half-size transform's output. */
const splits = new Map<number, { twiddles: Float64Array, spectrum: Float64Array }>()

function splitFor(size: number): { twiddles: Float64Array, spectrum: Float64Array } {
  let split = splits.get(size)
  if (!split) {
    // k ≤ N/4 is all the split reads.
    split = { twiddles: twiddleTable(size).slice(0, 2 * (size / 4 + 1)), spectrum: new Float64Array(size) }
    if (splits.size >= 16) splits.delete(splits.keys().next().value as number)
    splits.set(size, split)
  }
  return split
}
