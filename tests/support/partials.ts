import type { TrackMeasurement } from '../../shared/analysis/measureTrack'
import type { MeasuredPartial, PartialMatch } from '../../shared/analysis/types'

/**
 * Test builder: one measured partial as the engine reports it, a well-behaved 440 Hz
 * partial unless `fields` say otherwise.
 */
export function measuredPartial(fields: Partial<MeasuredPartial> = {}): MeasuredPartial {
  return {
    frequencyHz: 440, amplitudeDb: -20, decayDbPerS: 10, t60S: 6, r2: 0.99, startS: 0.1, endS: 2, stabilityCents: 0.1, beatHz: null, snrDb: 60,
    frames: 50, modulationHz: null, modulationDepthDb: null, crossCheckCents: 0, uncertaintyCents: 0.01, uncertaintyDecayPct: 1, ...fields,
  }
}

/** Test builder: one track's reading before the cross-check, with the track's own fields. */
export function trackReading(fields: Partial<TrackMeasurement> = {}): TrackMeasurement {
  return {
    frequencyHz: 440, amplitudeDb: -20, decayDbPerS: 10, t60S: 6, r2: 0.99, startS: 0.1, endS: 2, stabilityCents: 0.1,
    beatHz: null, snrDb: 60, frames: 50, modulationHz: null, modulationDepthDb: null,
    refineSpanS: 1.9, windowS: 0.1, strongestFrameDb: -22, modulationFrom: null, ...fields,
  }
}

/** Test builder: one template partial's match, found within its tolerance unless `fields` say otherwise. */
export function partialMatch(fields: Partial<PartialMatch> = {}): PartialMatch {
  return {
    label: 'fundamental', ratio: 1, targetHz: 440, measuredHz: 440, cents: 0, rawCents: 0, normalizedCents: null, toleranceCents: 5,
    within: true, missing: false, required: true, direction: 'on', amplitudeDb: -20, ...fields,
  }
}
