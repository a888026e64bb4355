/** Vertex of a parabola through three equally spaced samples. */
export interface ParabolicVertex {
  /** Offset of the vertex from the middle sample, in sample spacings (−0.5…+0.5 at a true maximum). */
  offset: number
  /** Value at the vertex (same unit as the inputs, e.g. dB). */
  value: number
}

/**
 * Parabolic interpolation of a spectral peak from the dB magnitudes of the bin below
 * (`leftDb`), the maximum (`centreDb`) and the bin above (`rightDb`) — the quadratic
 * interpolation of the log magnitude (a three-point fit; Grandke 1983, IEEE Trans. Instrum. Meas. 32(2)). On a log scale the main lobe
 * of a smooth window is close to a parabola, so the bias is a small fraction of a bin.
 */
export function parabolicPeak(leftDb: number, centreDb: number, rightDb: number): ParabolicVertex {
  const denominator = leftDb - 2 * centreDb + rightDb
  if (!(denominator < 0)) return { offset: 0, value: centreDb }
  const offset = (0.5 * (leftDb - rightDb)) / denominator
  return { offset, value: centreDb - 0.25 * (leftDb - rightDb) * offset }
}
