/**
 * Direct O(N²) DFT X[k] = Σ x[n] e^{−2πikn/N} of a real signal, all N bins, as
 * interleaved re/im. The reference the FFT is checked against; not used in the pipeline.
 */
export function directDft(signal: ArrayLike<number>): Float64Array {
  const n = signal.length
  const out = new Float64Array(2 * n)
  for (let k = 0; k < n; k++) {
    let re = 0
    let im = 0
    for (let j = 0; j < n; j++) {
      // Reduce k·j modulo n first so the angle stays small and accurate.
      const angle = (-2 * Math.PI * ((k * j) % n)) / n
      re += signal[j]! * Math.cos(angle)
      im += signal[j]! * Math.sin(angle)
    }
    out[2 * k] = re
    out[2 * k + 1] = im
  }
  return out
}
