// A tuned drum of our own scenario for the long-look tests: two strong low modes and, higher up,
// a weaker pair 9 Hz apart that a 0.2 s window sees as one lobe (a 4-term Blackman–Harris main
// lobe is 8 / T Hz wide: 40 Hz at 0.2 s, 8 Hz at 1 s; source: Harris 1978, Proc. IEEE 66(1)).
import type { MeasuredPartial } from '../../shared/analysis/types'
import type { SynthPartial } from './synthStrike'

export const LOW_MODES: SynthPartial[] = [
  { frequencyHz: 88, amplitudeDb: -10, decayDbPerS: 8 },
  { frequencyHz: 132, amplitudeDb: -14, decayDbPerS: 10 },
]

export const CLOSE_PAIR: SynthPartial[] = [
  { frequencyHz: 250, amplitudeDb: -32, decayDbPerS: 12 },
  { frequencyHz: 259, amplitudeDb: -30, decayDbPerS: 15 },
]

/** A synthetic partial as the bands would report it (frequency, level and modulation are what the long look uses). */
export function reportedPartial(p: SynthPartial, modulationHz: number | null = null): MeasuredPartial {
  return {
    frequencyHz: p.frequencyHz, amplitudeDb: p.amplitudeDb, decayDbPerS: p.decayDbPerS, t60S: 60 / p.decayDbPerS, r2: 0.99, startS: 0.06, endS: 1.9,
    stabilityCents: 0.01, beatHz: null, snrDb: 60, frames: 30, modulationHz, modulationDepthDb: modulationHz === null ? null : 6,
    crossCheckCents: 0, uncertaintyCents: 0.01, uncertaintyDecayPct: 1,
  }
}
