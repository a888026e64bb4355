import type { TrackMeasurement } from './measureTrack'

/**
 * Leave out the modulation sidebands of modulated partials: a partial weaker than one whose
 * spectrum showed symmetric sidebands (measureModulation) and lying k·f_m away from it (k = 1…`maxOrder`, within `toleranceHz` or
 * 5 % of f_m) is a sideband of that tremolo or vibrato (the modulation theorem), not a
 * mode of the piece. Strongest carriers first, so a sideband never removes its carrier.
 */
export function dropSidebands(partials: readonly TrackMeasurement[], maxOrder = 6, toleranceHz = 0.3): TrackMeasurement[] {
  const byLevel = [...partials].sort((a, b) => b.amplitudeDb - a.amplitudeDb)
  const dropped = new Set<TrackMeasurement>()
  for (const carrier of byLevel) {
    const rate = carrier.modulationHz ?? 0
    if (dropped.has(carrier) || carrier.modulationFrom !== 'sidebands' || !(rate > 0)) continue
    for (const other of byLevel) {
      if (other === carrier || dropped.has(other) || other.amplitudeDb > carrier.amplitudeDb) continue
      const order = Math.abs(other.frequencyHz - carrier.frequencyHz) / rate
      const k = Math.round(order)
      if (k >= 1 && k <= maxOrder && Math.abs(order - k) * rate <= Math.max(toleranceHz, 0.05 * rate)) dropped.add(other)
    }
  }
  return partials.filter(p => !dropped.has(p))
}
