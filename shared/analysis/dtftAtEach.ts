import type { Complex } from './dtftAt'
import { finishGoertzel } from './finishGoertzel'

/**
 * dtftAt at each of `frequenciesHz`: the same Goertzel recurrences (Goertzel 1958), the same
 * numbers, three at a time in one pass over the signal. Each recurrence waits on its own
 * previous step; three independent ones interleaved keep the processor busy for the time of one.
 */
export function dtftAtEach(signal: Float64Array, frequenciesHz: readonly number[], sampleRate: number): Complex[] {
  if (!(sampleRate > 0)) throw new RangeError('dtftAtEach needs a positive sample rate')
  const n = signal.length
  const out: Complex[] = []
  for (let first = 0; first < frequenciesHz.length; first += 3) {
    // A short last group repeats its last frequency (the copy's result is dropped).
    const last = frequenciesHz.length - 1
    const omegas = [0, 1, 2].map(k => (2 * Math.PI * frequenciesHz[Math.min(first + k, last)]!) / sampleRate)
    const [a, b, c] = omegas.map(omega => 2 * Math.cos(omega)) as [number, number, number]
    let a1 = 0
    let a2 = 0
    let b1 = 0
    let b2 = 0
    let c1 = 0
    let c2 = 0
    for (let i = 0; i < n; i++) {
      const x = signal[i]!
      const a0 = x + a * a1 - a2
      const b0 = x + b * b1 - b2
      const c0 = x + c * c1 - c2
      a2 = a1
      a1 = a0
      b2 = b1
      b1 = b0
      c2 = c1
      c1 = c0
    }
    const states = [[a1, a2], [b1, b2], [c1, c2]] as const
    for (let k = 0; k < 3 && first + k <= last; k++) out.push(finishGoertzel(states[k][0], states[k][1], omegas[k]!, n))
  }
  return out
}
