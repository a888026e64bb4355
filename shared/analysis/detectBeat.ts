export interface BeatSettings {
  /** Smallest residual modulation taken as beating, RMS in dB (e.g. 0.5). */
  minRmsDb: number
  /** Share of the residual's variance the strongest periodic component must carry (0…1). */
  minShare: number
}

/**
 * Beat rate in Hz of a dB envelope's residual (envelope minus its fitted decay line),
 * or null when the envelope is not modulated. The residual's periodogram is scanned
 * (a direct DFT at arbitrary rates, since frames may be missing) from 1.5 cycles per
 * track to the frame Nyquist rate; the envelope of two close partials repeats at their
 * frequency difference.
 */
export function detectBeat(timesS: ArrayLike<number>, residualsDb: ArrayLike<number>, settings: BeatSettings): number | null {
  const n = timesS.length
  if (n < 8) return null
  let variance = 0
  for (let i = 0; i < n; i++) variance += residualsDb[i]! ** 2
  variance /= n
  if (Math.sqrt(variance) < settings.minRmsDb) return null
  const spanS = timesS[n - 1]! - timesS[0]!
  const stepS = spanS / (n - 1)
  const lowHz = 1.5 / spanS
  const highHz = 0.5 / stepS
  if (!(highHz > lowHz)) return null
  const gridHz = 0.25 / spanS
  let bestHz = 0
  let bestPower = 0
  const powers: number[] = []
  // Each frame's e^{−2πi·f·(tᵢ − t₀)} stepped from rate to rate by its own e^{−2πi·grid·(tᵢ − t₀)}
  // (a rotation per frame and rate instead of a cosine and a sine; frames may be missing, so each has its own step).
  const { re: turnRe, im: turnIm } = phasors(timesS, lowHz)
  const { re: stepRe, im: stepIm } = phasors(timesS, gridHz)
  for (let f = lowHz; f <= highHz; f += gridHz) {
    let re = 0
    let im = 0
    for (let i = 0; i < n; i++) {
      const r = residualsDb[i]!
      const c = turnRe[i]!
      const s = turnIm[i]!
      re += r * c
      im += r * s
      turnRe[i] = c * stepRe[i]! - s * stepIm[i]!
      turnIm[i] = c * stepIm[i]! + s * stepRe[i]!
    }
    const power = re * re + im * im
    powers.push(power)
    if (power > bestPower) {
      bestPower = power
      bestHz = f
    }
  }
  // A pure sinusoidal residual of variance v gives power n²·v/2 at its rate.
  const share = (2 * bestPower) / (n * n * variance)
  if (share < settings.minShare) return null
  const i = Math.round((bestHz - lowHz) / gridHz)
  if (i > 0 && i < powers.length - 1) {
    const a = powers[i - 1]!
    const b = powers[i]!
    const c = powers[i + 1]!
    const d = a - 2 * b + c
    if (d < 0) bestHz += (0.5 * (a - c) / d) * gridHz
  }
  return bestHz
}

/** e^{−2πi·rateHz·(tᵢ − t₀)} for every frame. */
function phasors(timesS: ArrayLike<number>, rateHz: number): { re: Float64Array, im: Float64Array } {
  const re = new Float64Array(timesS.length)
  const im = new Float64Array(timesS.length)
  for (let i = 0; i < timesS.length; i++) {
    const angle = 2 * Math.PI * rateHz * (timesS[i]! - timesS[0]!)
    re[i] = Math.cos(angle)
    im[i] = -Math.sin(angle)
  }
  return { re, im }
}
