/**
 * Four-point Gauss–Legendre rule mapped to [0, 1]: exact for polynomials up to degree 7
 * (Abramowitz & Stegun, Handbook of Mathematical Functions, table 25.4).
 */
const ROOTS = [-0.8611363115940526, -0.3399810435848563, 0.3399810435848563, 0.8611363115940526]
const WEIGHTS = [0.3478548451374538, 0.6521451548625461, 0.6521451548625461, 0.3478548451374538]

export const GAUSS_POINTS: Float64Array = Float64Array.from(ROOTS, r => (r + 1) / 2)
export const GAUSS_WEIGHTS: Float64Array = Float64Array.from(WEIGHTS, w => w / 2)
