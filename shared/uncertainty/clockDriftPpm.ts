/** One calibration of a device as its drift history needs it: when, and the offset it showed. */
export interface OffsetReading {
  atMs: number
  offsetPpm: number
}

const MS_PER_DAY = 86_400_000

/**
 * How far a device's clock may have moved between its calibration and a strike, ppm: the
 * least-squares slope of its offset history (ppm per day, at least two calibrations on
 * different days' instants) times the days elapsed (JCGM 100:2008 §4.3.1: a Type B
 * estimate from earlier measurement data). Null when the history cannot show a slope.
 */
export function clockDriftPpm(history: readonly OffsetReading[], calibratedAtMs: number, strikeAtMs: number): number | null {
  if (!Number.isFinite(calibratedAtMs) || !Number.isFinite(strikeAtMs)) throw new RangeError('clockDriftPpm needs finite instants')
  if (history.some(h => !Number.isFinite(h.atMs) || !Number.isFinite(h.offsetPpm))) throw new RangeError('clockDriftPpm needs finite readings')
  const n = history.length
  if (n < 2) return null
  const meanT = history.reduce((s, h) => s + h.atMs, 0) / n / MS_PER_DAY
  const meanY = history.reduce((s, h) => s + h.offsetPpm, 0) / n
  let sxy = 0
  let sxx = 0
  for (const h of history) {
    const dt = h.atMs / MS_PER_DAY - meanT
    sxy += dt * (h.offsetPpm - meanY)
    sxx += dt * dt
  }
  if (sxx === 0) return null
  const slopePpmPerDay = sxy / sxx
  return Math.abs(slopePpmPerDay * (strikeAtMs - calibratedAtMs) / MS_PER_DAY)
}
