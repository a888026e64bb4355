/** Smallest power of two ≥ n (fft.js needs power-of-two sizes). */
export function nextPowerOfTwo(n: number): number {
  if (!(n >= 1)) return 1
  return 2 ** Math.ceil(Math.log2(n))
}
