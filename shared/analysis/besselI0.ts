/**
 * Modified Bessel function of the first kind, order zero, I₀(x), by the polynomial
 * approximations of Abramowitz & Stegun (1964) 9.8.1 (|x| ≤ 3.75, relative error
 * < 1.6·10⁻⁷) and 9.8.2 (|x| > 3.75, error < 1.9·10⁻⁷): ample for window design, and
 * fast enough to recompute a few thousand filter taps per band.
 */
export function besselI0(x: number): number {
  if (!Number.isFinite(x)) throw new RangeError('besselI0 needs a finite argument')
  const ax = Math.abs(x)
  if (ax <= 3.75) {
    const t = (ax / 3.75) ** 2
    return 1 + t * (3.5156229 + t * (3.0899424 + t * (1.2067492 + t * (0.2659732 + t * (0.0360768 + t * 0.0045813)))))
  }
  const t = 3.75 / ax
  const p = 0.39894228 + t * (0.01328592 + t * (0.00225319 + t * (-0.00157565 + t * (0.00916281
    + t * (-0.02057706 + t * (0.02635537 + t * (-0.01647633 + t * 0.00392377)))))))
  return (p * Math.exp(ax)) / Math.sqrt(ax)
}
