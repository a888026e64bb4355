import { basebandLevels } from './basebandLevels'
import type { Baseband } from './decimateBand'

/** Amplitude (or frequency) modulation of one partial, seen as sidebands. */
export interface Modulation {
  /** Modulation rate, in Hz (the sidebands' distance from the carrier). */
  rateHz: number
  /** Peak-to-trough depth of the envelope, in dB (20·log10((1 + m)/(1 − m)) for index m). */
  depthDb: number
}

export interface ModulationSettings {
  /** Slowest and fastest rate looked for, in Hz (tremolo of a rotating disc: 2–10 Hz). */
  minRateHz: number
  maxRateHz: number
  /** Sidebands weaker than the carrier by more than this, in dB, are not taken (noise, leakage). */
  maxBelowCarrierDb: number
  /** The two sidebands of a modulation agree within this, in dB; a lone neighbour is a second partial. */
  maxImbalanceDb: number
}

/**
 * Sidebands of a partial at `frequencyHz` in an already windowed long (baseband) span: its spectrum
 * over ±(maxRateHz + 1) Hz on a quarter-bin grid (basebandLevels). A tremolo x(t) = A(1 + m cos 2π f_m t)
 * cos 2π f t has two sidebands of A·m/2 at ±f_m (the modulation theorem); a symmetric pair
 * of local maxima, each within `maxBelowCarrierDb` of the carrier and within
 * `maxImbalanceDb` of each other, is a modulation of rate f_m and index m = (S₋ + S₊)/C.
 * Returns null when there is no such pair (or the span is too short to resolve the
 * slowest rate: the sidebands must clear the carrier's Blackman–Harris main lobe, 4 bins,
 * by 2 more, so 6 fs / N Hz).
 */
export function measureModulation(windowed: Baseband, frequencyHz: number, settings: ModulationSettings): Modulation | null {
  const binHz = 1 / (windowed.durationS ?? windowed.re.length / windowed.sampleRateHz)
  const minRateHz = Math.max(settings.minRateHz, 6 * binHz)
  if (minRateHz >= settings.maxRateHz) return null
  const grid = binHz / 4
  const level = basebandLevels(windowed, frequencyHz, settings.maxRateHz + 1, grid)
  const points = (level.length - 1) / 2
  const at = (j: number) => level[j + points]!
  const isMax = (j: number) => j > -points && j < points && at(j) >= at(j - 1) && at(j) >= at(j + 1)
  let carrierJ = 0
  for (let j = -4; j <= 4; j++) if (at(j) > at(carrierJ)) carrierJ = j
  const carrierDb = at(carrierJ)
  let best: { j: number, lowDb: number, highDb: number } | null = null
  for (let j = Math.ceil(minRateHz / grid); j * grid <= settings.maxRateHz; j++) {
    // Allow the mirror image one grid point off (the carrier itself sits between grid points).
    const up = [carrierJ + j - 1, carrierJ + j, carrierJ + j + 1].find(isMax)
    const down = [carrierJ - j + 1, carrierJ - j, carrierJ - j - 1].find(isMax)
    if (up === undefined || down === undefined || up !== carrierJ + j) continue
    const highDb = at(up)
    const lowDb = at(down)
    if (Math.max(highDb, lowDb) > carrierDb) continue
    if (Math.min(highDb, lowDb) < carrierDb - settings.maxBelowCarrierDb) continue
    if (Math.abs(highDb - lowDb) > settings.maxImbalanceDb) continue
    if (!best || highDb + lowDb > best.highDb + best.lowDb) best = { j, lowDb, highDb }
  }
  if (!best) return null
  const index = Math.min(0.98, 10 ** ((best.lowDb - carrierDb) / 20) + 10 ** ((best.highDb - carrierDb) / 20))
  return { rateHz: best.j * grid, depthDb: 20 * Math.log10((1 + index) / (1 - index)) }
}
