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
  const states = new Float64Array(6)
  const last = frequenciesHz.length - 1
  for (let first = 0; first <= last; first += 3) {
    // A short last group repeats its last frequency (the copy's result is dropped).
    const omegaA = (2 * Math.PI * frequenciesHz[first]!) / sampleRate
    const omegaB = (2 * Math.PI * frequenciesHz[Math.min(first + 1, last)]!) / sampleRate
    const omegaC = (2 * Math.PI * frequenciesHz[Math.min(first + 2, last)]!) / sampleRate
    goertzelThree(signal, 2 * Math.cos(omegaA), 2 * Math.cos(omegaB), 2 * Math.cos(omegaC), states)
    out.push(finishGoertzel(states[0]!, states[1]!, omegaA, n))
    if (first + 1 <= last) out.push(finishGoertzel(states[2]!, states[3]!, omegaB, n))
    if (first + 2 <= last) out.push(finishGoertzel(states[4]!, states[5]!, omegaC, n))
  }
  return out
}

/** The three recurrences s ← x + c·s₁ − s₂; their last two states, in pairs, into `states`. */
function goertzelThree(signal: Float64Array, a: number, b: number, c: number, states: Float64Array): void {
  let a1 = 0
  let a2 = 0
  let b1 = 0
  let b2 = 0
  let c1 = 0
  let c2 = 0
  for (let i = 0; i < signal.length; i++) {
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
  states[0] = a1
  states[1] = a2
  states[2] = b1
  states[3] = b2
  states[4] = c1
  states[5] = c2
}
