import type { Complex } from './dtftAt'

/**
 * A Goertzel recurrence's last two states `s1`, `s2` after `n` samples at ω rad/sample
 * as the DTFT value (Goertzel 1958): y[N−1] = s1 − e^{−iω} s2 gives Σ x[n] e^{iω(N−1−n)};
 * multiplying by e^{−iω(N−1)} references the phase to n = 0.
 */
export function finishGoertzel(s1: number, s2: number, omega: number, n: number): Complex {
  const yRe = s1 - Math.cos(omega) * s2
  const yIm = Math.sin(omega) * s2
  const phase = -omega * (n - 1)
  const c = Math.cos(phase)
  const s = Math.sin(phase)
  return { re: yRe * c - yIm * s, im: yRe * s + yIm * c }
}
