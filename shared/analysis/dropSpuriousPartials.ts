import type { TrackMeasurement } from './measureTrack'
import { wandersOverLobe } from './wandersOverLobe'

export interface SpuriousSettings {
  /** Level of the strongest partial of the strike, dB re full scale. */
  strongestDb: number
  /** A steady line this far or further under the strongest partial is no mode of the strike, dB. */
  steadyBelowDb: number
  /** Slowest decay, dB/s, and poorest fit of the decay line (r²) that make a line steady. */
  steadyDecayDbPerS: number
  steadyR2: number
  /** A reading this far under the strongest partial must stand `faintMinSnrDb` over the noise, dB. */
  faintBelowDb: number
  faintMinSnrDb: number
  /** Mains hum's lines among the readings (findMainsHum), Hz: left out as steady lines, but named elsewhere, so not counted here. */
  humLinesHz?: readonly number[]
}

/** Partials worth reporting, and one plain line per kind left out. */
export interface HonestPartials {
  kept: TrackMeasurement[]
  warnings: string[]
}

/**
 * Leave out readings that are no partial of the struck piece:
 * - a track whose frequency spreads (RMS) over more than a quarter of its window's main
 *   lobe (2 bins of a Blackman–Harris window, Harris 1978): one partial read at an SNR of
 *   20 dB or more stays within a small fraction of a bin (Rife & Boorstyn 1974), so such a
 *   track chains different peaks (noise, overlapping skirts), not one sinusoid — unless
 *   its spectrum showed the symmetric sidebands of a vibrato (measureModulation): a
 *   frequency-modulated partial swings by its peak deviation (RMS spread = deviation / √2),
 *   and while the deviation stays within twice the rate (index β ≤ 2) its first sidebands
 *   are the strongest (J₁(2) > J₂(2)), as measureModulation saw them; so it may spread up to
 *   √2 × its rate (a sampled glockenspiel's 9 kHz partial with a 14 Hz vibrato spreads 18 Hz);
 * - a steady line — not decaying (under `steadyDecayDbPerS`) and not following a decay line
 *   (r² under `steadyR2`) — more than `steadyBelowDb` under the strongest partial: a
 *   struck piece's modes decay from the blow, while hum, a sampled note's loop artefacts or
 *   a machine in the room hold their level.
 * - a faint reading: more than `faintBelowDb` under the strongest partial and less than
 *   `faintMinSnrDb` over the noise — the chains of a mallet's noise and a room's tail in the
 *   first frames, never a tuned partial, and too close to the noise for a reading in cents.
 * Slowly decaying modes (bells, tubes, vibraphone bars) fit their decay line and are kept.
 */
export function dropSpuriousPartials(partials: readonly TrackMeasurement[], settings: SpuriousSettings): HonestPartials {
  const kept: TrackMeasurement[] = []
  let wandering = 0
  let steady = 0
  let faint = 0
  for (const p of partials) {
    if (wandersOverLobe(p)) wandering++
    else if (p.decayDbPerS < settings.steadyDecayDbPerS && p.r2 < settings.steadyR2 && p.amplitudeDb < settings.strongestDb - settings.steadyBelowDb) {
      if (!settings.humLinesHz?.includes(p.frequencyHz)) steady++
    }
    else if (p.amplitudeDb < settings.strongestDb - settings.faintBelowDb && p.snrDb < settings.faintMinSnrDb) faint++
    else kept.push(p)
  }
  const warnings: string[] = []
  if (wandering > 0) warnings.push(`${wandering} track${wandering === 1 ? '' : 's'} not reported: frequency wandering over its window's main lobe (no single partial)`)
  if (steady > 0) warnings.push(`${steady} steady line${steady === 1 ? '' : 's'} far under the strike not reported (hum or a recording artefact, not a decaying mode)`)
  if (faint > 0) warnings.push(`${faint} faint reading${faint === 1 ? '' : 's'} not reported: more than ${settings.faintBelowDb} dB under the strongest partial and less than ${settings.faintMinSnrDb} dB over the noise`)
  return { kept, warnings }
}
