import { dampedSinusoidCrb } from './dampedSinusoidCrb'
import { matrixPencil, type ExponentialFit } from './matrixPencil'
import type { BandSource } from './bandSource'
import { mixDownBand, type BandSignal, type MixDownSettings } from './mixDownBand'
import { mixDownCoarse } from './mixDownCoarse'
import { phasorTable } from './phasorTable'
import { refineExponentials } from './refineExponentials'
import { DB_PER_NEPER } from './units'

/** One damped sinusoid found in a band. */
export interface BandComponent {
  frequencyHz: number
  /** Decay of the envelope in dB/s (positive: decaying). */
  decayDbPerS: number
  /** Peak amplitude at the reference sample (linear, a full-scale sine is 1). */
  amplitude: number
  /** Phase of the cosine at the reference sample, in rad. */
  phaseRad: number
  /** One standard deviation of the frequency and of the decay from the Cramér–Rao bound at the measured values. */
  frequencySdHz: number
  decaySdDbPerS: number
  /** Level over the band's noise (per band sample, at the start of the span), in dB. */
  snrDb: number
}

/** What the band estimator saw and found. */
export interface BandEstimate {
  /** Components inside the passband, lowest first. */
  components: BandComponent[]
  /** Half-width of the passband around the centre, in Hz. */
  halfWidthHz: number
  /** Sample rate and length of the decimated band signal. */
  bandRateHz: number
  samples: number
  /** Time span the band samples cover, in s. */
  spanS: number
  /** RMS of the fit's residual per band sample (complex, full scale = 1). */
  noiseRms: number
}

export interface BandSettings {
  /** First and one-past-last input sample that may be used. */
  startIndex: number
  endIndex: number
  /** Smallest half-width of the passband around `centerHz`, in Hz. */
  halfWidthHz: number
  /** Number of band samples aimed for (default 48; more when the band must be wide, up to twice that: a longer span is shortened). */
  targetSamples?: number
  /** Fixed number of exponentials, or limits for the MDL choice (default 1 … 6). */
  order?: number
  minOrder?: number
  maxOrder?: number
  /** Sample that amplitudes and phases refer to (default startIndex). */
  referenceIndex?: number
  /** Decimated bands of this same signal (bandSource): the down-mix then starts from one of them (mixDownCoarse), at a fraction of the cost. */
  bands?: BandSource
}

/** Passband half-width as a fraction of the band's sample rate (see mixDownBand). */
const PASSBAND = 1 / 8

/**
 * Damped sinusoids in one band of a recording: mix the band down to 0 Hz and decimate
 * (mixDownBand) to about `targetSamples` samples, so the pencil's matrices stay small,
 * then fit K damped exponentials by the matrix pencil (matrixPencil), refined by least
 * squares (refineExponentials). Each pole maps back
 * to frequency (Hz) and decay (dB/s); its amplitude is corrected for the filter's gain at
 * the pole and referred to `referenceIndex`; its uncertainty is the Cramér–Rao bound
 * (dampedSinusoidCrb) evaluated at the measured amplitude, decay, length and residual noise.
 * Returns null when the span is too short for eight band samples, and when the band cannot
 * be read (fitBand); bad arguments throw.
 */
export function estimateBand(signal: Float64Array, sampleRate: number, centerHz: number, settings: BandSettings): BandEstimate | null {
  const { startIndex, endIndex, halfWidthHz } = settings
  if (!(halfWidthHz > 0)) throw new RangeError('estimateBand needs a positive half-width')
  if (!(centerHz > 0 && centerHz < sampleRate / 2)) throw new RangeError('estimateBand needs a centre frequency inside the recording\'s band')
  if (!(startIndex >= 0 && endIndex <= signal.length && startIndex < endIndex)) throw new RangeError('estimateBand needs a span inside the signal')
  const target = settings.targetSamples ?? 48
  const span = endIndex - startIndex
  // The largest factor that keeps the passband (±⅛ of the band rate) at least halfWidthHz,
  // and the one that gives about `target` samples (the filter takes ~4 factors), taken
  // down to a ladder of factors (so filter designs repeat); a span that would give more
  // than twice `target` samples is shortened (cost, and the pencil's matrices stay small).
  const byBand = Math.floor((PASSBAND * sampleRate) / halfWidthHz)
  const byLength = Math.floor(span / (target + 4))
  const factor = ladderFactor(Math.max(2, Math.min(byBand, byLength)))
  const end = Math.min(endIndex, startIndex + (2 * target + 5) * factor)
  const band = mixDown(signal, sampleRate, centerHz, { startIndex, endIndex: end, factor, passbandFraction: PASSBAND }, settings.bands)
  const samples = band.re.length
  if (samples < 8) return null
  const fit = fitBand(band, settings.order, settings.minOrder, Math.min(settings.maxOrder ?? 6, Math.floor(samples / 4)))
  if (!fit) return null
  const order = fit.frequencyCycles.length
  const noiseRms = fit.residualRms * Math.sqrt(samples / Math.max(1, samples - 2 * order))
  const bandRateHz = sampleRate / factor
  const reference = settings.referenceIndex ?? startIndex
  const omegaCenter = (2 * Math.PI * centerHz) / sampleRate
  const delay = (band.taps.length - 1) / 2
  const components: BandComponent[] = []
  const phasors = { cos: new Float64Array(delay + 1), sin: new Float64Array(delay + 1) }
  for (let k = 0; k < order; k++) {
    const nu = fit.frequencyCycles[k]!
    const damping = fit.dampingNepers[k]!
    // A component of no amplitude or no finite damping is no reading (and has no bound).
    if (Math.abs(nu) > 0.25 || !(fit.amplitude[k]! > 0) || !Number.isFinite(damping)) continue
    // Filter gain at the pole, per tap (tapStep input samples): H = Σ h[j]·u^{j − c}, u = e^{(−δ + 2πiν)·step/D}.
    const dampingPerSample = damping / factor
    const omegaOffset = (2 * Math.PI * nu) / factor
    // Symmetric taps: h[c](1) + Σ_k h[c+k]·(u^k + u^{−k}), by recurrences.
    let hRe = band.taps[delay]!
    let hIm = 0
    const upStep = Math.exp(dampingPerSample * band.tapStep)
    const phasor = phasorTable(omegaOffset * band.tapStep, delay + 1, phasors)
    let up = 1
    for (let j = 1; j <= delay; j++) {
      up *= upStep
      const h = band.taps[delay + j]!
      hRe += h * (up + 1 / up) * phasor.cos[j]!
      hIm += h * (1 / up - up) * phasor.sin[j]!
    }
    const gain = Math.hypot(hRe, hIm)
    const omega = omegaCenter + omegaOffset
    const amplitudeFirst = (2 * fit.amplitude[k]!) / gain
    const phaseFirst = fit.phaseRad[k]! - Math.atan2(hIm, hRe) + omegaCenter * band.firstIndex
    const bound = noiseRms > 0
      ? dampedSinusoidCrb(2 * fit.amplitude[k]!, noiseRms, damping, samples)
      : { frequencySdRad: 0, dampingSdNepers: 0 }
    components.push({
      frequencyHz: centerHz + nu * bandRateHz,
      decayDbPerS: damping * bandRateHz * DB_PER_NEPER,
      amplitude: amplitudeFirst * Math.exp(dampingPerSample * (band.firstIndex - reference)),
      phaseRad: wrapPhase(phaseFirst - omega * (band.firstIndex - reference)),
      frequencySdHz: (bound.frequencySdRad * bandRateHz) / (2 * Math.PI),
      decaySdDbPerS: bound.dampingSdNepers * bandRateHz * DB_PER_NEPER,
      snrDb: 20 * Math.log10(fit.amplitude[k]! / Math.max(noiseRms, 1e-300)),
    })
  }
  return {
    components,
    halfWidthHz: PASSBAND * bandRateHz,
    bandRateHz,
    samples,
    spanS: (samples * factor) / sampleRate,
    noiseRms,
  }
}

/**
 * The band mixed down and decimated: from the coarsest band of `bands` that divides the factor by
 * four or more and holds the low-pass's stopband edge (mixDownCoarse), else from the input itself.
 */
function mixDown(signal: Float64Array, sampleRate: number, centerHz: number, settings: MixDownSettings, bands: BandSource | undefined): BandSignal {
  const { factor, startIndex, endIndex } = settings
  let coarsest = 1
  while (factor % (2 * coarsest) === 0 && factor / (2 * coarsest) >= 4) coarsest *= 2
  const edgeHz = ((1 - (settings.passbandFraction ?? PASSBAND)) * sampleRate) / factor
  const coarse = bands && coarsest >= 2 ? bands(centerHz, edgeHz, coarsest, startIndex, endIndex - startIndex) : null
  return coarse && coarse.factor >= 2 ? mixDownCoarse(coarse, centerHz, settings) : mixDownBand(signal, sampleRate, centerHz, settings)
}

/**
 * The pencil's fit refined by least squares, or null for a band the numerics cannot read:
 * digital silence makes the amplitudes' system singular, and an eigenvalue iteration may not
 * settle (realEigenvalues). Every caller treats such a band as holding nothing, so the rule is here.
 */
function fitBand(band: BandSignal, order: number | undefined, minOrder: number | undefined, maxOrder: number): ExponentialFit | null {
  try {
    return refineExponentials(band, matrixPencil(band, { order, minOrder, maxOrder }))
  }
  catch {
    return null
  }
}

/** The largest factor ≤ `factor` of the form m·2^e with m in 4 … 7 (or factor itself below 8). */
function ladderFactor(factor: number): number {
  if (factor < 8) return factor
  const step = 2 ** (Math.floor(Math.log2(factor)) - 2)
  return Math.floor(factor / step) * step
}

function wrapPhase(phase: number): number {
  return phase - 2 * Math.PI * Math.round(phase / (2 * Math.PI))
}
