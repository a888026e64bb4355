import { MAIN_LOBE_BINS } from './chooseWindow'
import type { TrackMeasurement } from './measureTrack'

/**
 * Whether a track's frequency spreads (RMS) over more than a quarter of its window's main lobe
 * (2 bins of a Blackman–Harris window, Harris 1978), or over √2 × its vibrato's rate where its
 * spectrum showed a vibrato's sidebands: a chain of different peaks, not one partial. Such a
 * reading is left out (dropSpuriousPartials) and holds no place among the bands (measureAllBands).
 */
export function wandersOverLobe(p: Pick<TrackMeasurement, 'frequencyHz' | 'stabilityCents' | 'windowS' | 'modulationFrom' | 'modulationHz'>): boolean {
  const spreadHz = p.frequencyHz * (2 ** (p.stabilityCents / 1200) - 1)
  const binHz = 1 / p.windowS
  const vibratoHz = p.modulationFrom === 'sidebands' ? Math.SQRT2 * (p.modulationHz ?? 0) : 0
  return spreadHz > Math.max((MAIN_LOBE_BINS / 4) * binHz, vibratoHz)
}
