import { MAIN_LOBE_BINS } from './chooseWindow'
import { firstAtOrAbove } from './firstAtOrAbove'
import { ENGINE_SETTINGS } from './engineSettings'
import type { TrackMeasurement } from './measureTrack'

/**
 * Fastest modulation whose sidebands are left out, Hz: twice the fastest tremolo looked for,
 * so a sampled note's loop (17.5 Hz on a freepats xylophone) still counts; a "pair" found
 * inside a short window's lobe (150 Hz apart in a 25 ms band) is no modulation of a partial.
 */
const MAX_SIDEBAND_RATE_HZ = 2 * ENGINE_SETTINGS.modulation.maxRateHz
/** How far a sideband's shoulder inside the carrier's main lobe may be pulled off k·f_m, as a share of f_m. */
const IN_LOBE_SHARE = 0.3
/** Sidebands of order over `maxOrder`, up to this, are left out when this far under the carrier, dB. */
const HIGH_ORDER_MAX = 16
const HIGH_ORDER_BELOW_DB = 20
/** Slowest tremolo looked for, Hz. */
const TREMOLO_MIN_HZ = ENGINE_SETTINGS.modulation.minRateHz

/**
 * Leave out the modulation sidebands of modulated partials: a partial weaker than one whose
 * spectrum showed symmetric sidebands (measureModulation) and lying k·f_m away from it (k = 1…`maxOrder`, within `toleranceHz` or
 * 5 % of f_m) is a sideband of that tremolo or vibrato (the modulation theorem), not a
 * mode of the piece; up to order 16 when 20 dB or more under the carrier (an envelope that is no
 * pure sine has harmonics). Only rates up to `maxRateHz` are modulations. Strongest carriers first, so a sideband never removes its carrier.
 * A symmetric pair around any partial at the rate of a tremolo another partial showed (1.5–12 Hz)
 * is left out too, when its levels are a tremolo's (sidebandLevels): the discs modulate every
 * partial, but a weak one's own spectrum may not show it.
 * "Weaker" looks at both levels a track has (weakerThan): a sideband read by a short window
 * whose decay line overshoots to an onset amplitude over its carrier's is still no carrier.
 */
export function dropSidebands(partials: readonly TrackMeasurement[], maxOrder = 6, toleranceHz = 0.3, maxRateHz = MAX_SIDEBAND_RATE_HZ): TrackMeasurement[] {
  const byLevel = [...partials].sort((a, b) => b.amplitudeDb - a.amplitudeDb)
  // Partials by frequency, each with its rank by level: a search looks only where a sideband can be
  // (a dense strike — a cymbal's hundreds of readings — must not cost partials² × rates).
  const rank = new Map(byLevel.map((p, i) => [p, i]))
  const byFrequency = [...byLevel].sort((a, b) => a.frequencyHz - b.frequencyHz)
  const within = (loHz: number, hiHz: number) => byFrequency.slice(firstAtOrAbove(byFrequency, loHz), firstAtOrAbove(byFrequency, hiHz, true))
  const dropped = new Set<TrackMeasurement>()
  for (const carrier of byLevel) {
    const rate = carrier.modulationHz ?? 0
    if (dropped.has(carrier) || carrier.modulationFrom !== 'sidebands' || !(rate > 0) || rate > maxRateHz) continue
    const reachHz = Math.max(maxOrder, HIGH_ORDER_MAX) * rate + Math.max(toleranceHz, 0.05 * rate) + 1e-9
    for (const other of within(carrier.frequencyHz - reachHz, carrier.frequencyHz + reachHz)) {
      if (other === carrier || dropped.has(other) || !weakerThan(other, carrier)) continue
      const order = Math.abs(other.frequencyHz - carrier.frequencyHz) / rate
      const k = Math.round(order)
      // A sideband inside (or at the edge of) the carrier's main lobe is no peak of its own: it shows as
      // a shoulder, pulled off k·f_m by the carrier's skirt (a 4 Hz tremolo's in a 0.5 s window: ±4.9, ±8.7 Hz).
      const inLobe = k * rate < (MAIN_LOBE_BINS / 2 + 1) / carrier.windowS && carrier.amplitudeDb - other.amplitudeDb >= MIN_BELOW_CARRIER_DB
      const tolHz = Math.max(toleranceHz, 0.05 * rate, inLobe ? IN_LOBE_SHARE * rate : 0)
      // A tremolo that is no pure sine (discs that open and shut) has sidebands of higher order, ever weaker.
      const highOrder = k > maxOrder && k <= HIGH_ORDER_MAX && carrier.amplitudeDb - other.amplitudeDb >= HIGH_ORDER_BELOW_DB
      if (k >= 1 && (k <= maxOrder || highOrder) && Math.abs(order - k) * rate <= tolHz) dropped.add(other)
    }
  }
  // A tremolo modulates every partial of the strike at one rate, but a weak partial's own
  // spectrum may not show it: a symmetric pair at ± a rate another partial showed is its sidebands too.
  const strikeRatesHz = [...new Set(byLevel
    .filter(p => p.modulationFrom === 'sidebands' && p.modulationHz !== null && p.modulationHz >= TREMOLO_MIN_HZ && p.modulationHz <= ENGINE_SETTINGS.modulation.maxRateHz)
    .map(p => p.modulationHz!))]
  for (const carrier of byLevel) {
    if (dropped.has(carrier)) continue
    for (const rate of strikeRatesHz) {
      // The strongest partial near hz that qualifies, as a scan of byLevel would find it first.
      const at = (hz: number) => {
        const tol = Math.max(toleranceHz, 0.05 * rate)
        let best: TrackMeasurement | undefined
        for (const o of within(hz - tol - 1e-9, hz + tol + 1e-9)) {
          if (o === carrier || dropped.has(o) || !weakerThan(o, carrier) || Math.abs(o.frequencyHz - hz) > tol) continue
          if (!best || rank.get(o)! < rank.get(best)!) best = o
        }
        return best
      }
      const lower = at(carrier.frequencyHz - rate)
      const upper = at(carrier.frequencyHz + rate)
      if (lower && upper && sidebandLevels(carrier, lower, upper)) {
        dropped.add(lower)
        dropped.add(upper)
      }
    }
  }
  return partials.filter(p => !dropped.has(p))
}

/** Levels of a sideband against its carrier's: never seen stronger in a frame (6 dB slack). */
const SIDEBAND_FRAME_SLACK_DB = 6
/** A track whose strongest frame lies this far under another's is weaker, whatever its onset amplitude says. */
const FRAME_GAP_DB = 20

/**
 * `other` is weaker than `carrier`: its strongest frame (the level actually seen) is not over
 * the carrier's, and either its onset amplitude is not over the carrier's or its strongest
 * frame lies 20 dB or more under the carrier's (an onset amplitude drawn back along a poorly
 * fitted decay from a weak track, as on a clipped recording with tremolo, overshoots).
 */
function weakerThan(other: TrackMeasurement, carrier: TrackMeasurement): boolean {
  if (other.strongestFrameDb > carrier.strongestFrameDb + SIDEBAND_FRAME_SLACK_DB) return false
  return other.amplitudeDb <= carrier.amplitudeDb || other.strongestFrameDb < carrier.strongestFrameDb - FRAME_GAP_DB
}

/** A tremolo's sidebands each lie at 20·log10(m/2) ≤ −6 dB under the carrier (modulation index m ≤ 1). */
const MIN_BELOW_CARRIER_DB = 6

/**
 * Whether two partials around a carrier have a tremolo's sideband levels: each at least 6 dB and
 * at most `maxBelowCarrierDb` under the carrier, within `maxImbalanceDb` of each other (the
 * modulation theorem gives equal sidebands; engineSettings' modulation limits). A bell's uneven
 * neighbours 9.5 dB apart are no sidebands.
 */
function sidebandLevels(carrier: TrackMeasurement, lower: TrackMeasurement, upper: TrackMeasurement): boolean {
  const { maxBelowCarrierDb, maxImbalanceDb } = ENGINE_SETTINGS.modulation
  const below = [lower, upper].map(p => carrier.amplitudeDb - p.amplitudeDb)
  return below.every(d => d >= MIN_BELOW_CARRIER_DB && d <= maxBelowCarrierDb) && Math.abs(lower.amplitudeDb - upper.amplitudeDb) <= maxImbalanceDb
}
