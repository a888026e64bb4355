import type { TrackMeasurement } from './measureTrack'

/**
 * A partial can be tracked twice (a track that broke in a beat null and started again):
 * keep the longer track of any two closer than the resolution of their long windows.
 * Returns the kept partials by ascending frequency.
 */
export function dropDuplicates(measured: readonly TrackMeasurement[]): TrackMeasurement[] {
  const byLength = [...measured].sort((a, b) => b.frames - a.frames || b.amplitudeDb - a.amplitudeDb)
  const kept: TrackMeasurement[] = []
  for (const m of byLength) {
    const clash = kept.some(k => Math.abs(k.frequencyHz - m.frequencyHz) < 1 / Math.min(k.refineSpanS, m.refineSpanS))
    if (!clash) kept.push(m)
  }
  return kept.sort((a, b) => a.frequencyHz - b.frequencyHz)
}
