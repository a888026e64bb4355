import type { BandComponent } from './estimateBand'
import { partialUncertaintyCents } from './partialUncertaintyCents'
import type { MeasuredPartial } from './types'
import { CENTS_PER_LOG } from './units'
import { partialUncertaintyDecayPct } from './partialUncertaintyDecayPct'

export interface PencilPartialContext {
  /** Span the component was measured over, in s from the start of the file. */
  startS: number
  endS: number
  beatHz?: number | null
  modulationHz?: number | null
  modulationDepthDb?: number | null
}

/**
 * A partial read by the matrix pencil alone (one component of estimateBand): frequency,
 * decay and amplitude are the pencil's; there is no FFT reading to compare, so
 * `crossCheckCents` is null and the uncertainties are the Cramér–Rao bound at the measured
 * values (Yao & Pandit 1995), the frequency's with its line's allowance
 * (partialUncertaintyCents). `stabilityCents` carries the frequency's bound in cents (there are no
 * frames), `r2` the share of the band's power the exponential holds at its start,
 * SNR / (SNR + 1), and `frames` is 0.
 */
export function pencilPartial(component: BandComponent, context: PencilPartialContext): MeasuredPartial {
  const { frequencyHz, decayDbPerS } = component
  if (!(frequencyHz > 0)) throw new RangeError('pencilPartial needs a positive frequency')
  const boundCents = (CENTS_PER_LOG * component.frequencySdHz) / frequencyHz
  const snr = 10 ** (component.snrDb / 10)
  return {
    frequencyHz,
    amplitudeDb: 20 * Math.log10(Math.max(component.amplitude, 1e-12)),
    decayDbPerS,
    t60S: decayDbPerS > 0 ? 60 / decayDbPerS : null,
    r2: snr / (snr + 1),
    startS: context.startS,
    endS: context.endS,
    stabilityCents: boundCents,
    beatHz: context.beatHz ?? null,
    snrDb: component.snrDb,
    frames: 0,
    modulationHz: context.modulationHz ?? null,
    modulationDepthDb: context.modulationDepthDb ?? null,
    crossCheckCents: null,
    uncertaintyCents: partialUncertaintyCents(boundCents, 0, frequencyHz, decayDbPerS),
    uncertaintyDecayPct: partialUncertaintyDecayPct(component.decaySdDbPerS, 0, decayDbPerS),
  }
}
