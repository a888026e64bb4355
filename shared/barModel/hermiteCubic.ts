/**
 * Hermite cubic shape functions of a two-node beam element of length `lengthM` at
 * ξ = x / length (0…1), for the degrees of freedom (w₁, θ₁, w₂, θ₂): the values N and
 * the second derivatives N″ with respect to x (standard beam element, e.g. Przemieniecki,
 * Theory of Matrix Structural Analysis, ch. 5).
 */
export function hermiteCubic(xi: number, lengthM: number): { value: Float64Array, curvature: Float64Array } {
  if (!(lengthM > 0)) throw new RangeError('element length must be positive')
  const l = lengthM
  const x2 = xi * xi
  const x3 = x2 * xi
  const value = Float64Array.of(1 - 3 * x2 + 2 * x3, l * (xi - 2 * x2 + x3), 3 * x2 - 2 * x3, l * (x3 - x2))
  const curvature = Float64Array.of((12 * xi - 6) / (l * l), (6 * xi - 4) / l, (6 - 12 * xi) / (l * l), (6 * xi - 2) / l)
  return { value, curvature }
}
