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
 * Sidebands of a partial at `frequencyHz` in an already windowed long span: the span is
 * mixed down to 0 Hz and summed in blocks (a boxcar low-pass, its droop divided out) to
 * about 8 × `maxRateHz` samples per second, and the spectrum of that short sequence is
 * scanned over ±(maxRateHz + 1) Hz on a quarter-bin grid. A tremolo x(t) = A(1 + m cos 2π f_m t)
 * cos 2π f t has two sidebands of A·m/2 at ±f_m (the modulation theorem); a symmetric pair
 * of local maxima, each within `maxBelowCarrierDb` of the carrier and within
 * `maxImbalanceDb` of each other, is a modulation of rate f_m and index m = (S₋ + S₊)/C.
 * Returns null when there is no such pair (or the span is too short to resolve the
 * slowest rate: the sidebands must clear the carrier's Blackman–Harris main lobe, 4 bins,
 * by 2 more, so 6 fs / N Hz).
 */
export function measureModulation(windowed: Float64Array, sampleRate: number, frequencyHz: number, settings: ModulationSettings): Modulation | null {
  const n = windowed.length
  const binHz = sampleRate / n
  const minRateHz = Math.max(settings.minRateHz, 6 * binHz)
  if (minRateHz >= settings.maxRateHz) return null
  const block = Math.max(1, Math.floor(sampleRate / (8 * settings.maxRateHz)))
  const count = Math.floor(n / block)
  const re = new Float64Array(count)
  const im = new Float64Array(count)
  const step = (-2 * Math.PI * frequencyHz) / sampleRate
  // Phasor rotation re-seeded every block so rounding cannot build up.
  for (let b = 0; b < count; b++) {
    let c = Math.cos(step * b * block)
    let s = Math.sin(step * b * block)
    const cs = Math.cos(step)
    const sn = Math.sin(step)
    let sr = 0
    let si = 0
    for (let i = b * block; i < (b + 1) * block; i++) {
      const x = windowed[i]!
      sr += x * c
      si += x * s
      const next = c * cs - s * sn
      s = s * cs + c * sn
      c = next
    }
    re[b] = sr
    im[b] = si
  }
  const grid = binHz / 4
  const reach = settings.maxRateHz + 1
  const points = Math.ceil(reach / grid)
  const level = new Float64Array(2 * points + 1)
  const blockS = block / sampleRate
  for (let j = -points; j <= points; j++) {
    const nu = j * grid
    const w = -2 * Math.PI * nu * blockS
    let sr = 0
    let si = 0
    // Block b's sum is centred at (b + (block − 1)/2) samples; the phase reference does not change the power.
    const cw = Math.cos(w)
    const sw = Math.sin(w)
    let c = 1
    let s = 0
    for (let b = 0; b < count; b++) {
      sr += re[b]! * c - im[b]! * s
      si += re[b]! * s + im[b]! * c
      const next = c * cw - s * sw
      s = s * cw + c * sw
      c = next
    }
    const x = Math.PI * nu / sampleRate
    const droop = x === 0 ? 1 : Math.abs(Math.sin(block * x) / (block * Math.sin(x)))
    level[j + points] = 10 * Math.log10((sr * sr + si * si) / (droop * droop) + 1e-300)
  }
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
