import { MAIN_LOBE_BINS, spanNeededS } from './chooseWindow'
import type { TrackMeasurement } from './measureTrack'

export interface PhysicalBounds {
  /** The file's own peak level, dB re full scale: no partial of it can be louder. */
  peakDb: number
  peakMarginDb: number
  sampleRate: number
  minFrequencyHz: number
  /** Span analysed after the strike, s (a short one limits the window, and so the lowest partial). */
  spanS: number
  maxDecayDbPerS: number
  maxGrowthDbPerS: number
}

/** Partials inside the bounds, one plain line per kind of reading left out, and what a better recording would need. */
export interface GuardedPartials {
  kept: TrackMeasurement[]
  warnings: string[]
  advice: string[]
}

/** Whether a reading's decay over its track stays within what the track stood over the noise (plus 30 dB of fit slack). */
export function decayShownBySpan(p: Pick<TrackMeasurement, 'decayDbPerS' | 'startS' | 'endS' | 'snrDb'>): boolean {
  return p.decayDbPerS * (p.endS - p.startS) <= p.snrDb + 30
}

/**
 * Whether a growing reading's rise over its track stays within the swing of its own measured
 * modulation: a tremolo or a beat seen over less than a cycle or two tilts the fitted line
 * either way, so the rise says nothing of the partial's decay.
 */
export function riseWithinModulation(p: Pick<TrackMeasurement, 'decayDbPerS' | 'startS' | 'endS' | 'modulationDepthDb'>): boolean {
  return p.modulationDepthDb !== null && -p.decayDbPerS * (p.endS - p.startS) <= p.modulationDepthDb
}

/**
 * Physical bounds of a partial of a strike: its onset amplitude cannot exceed the file's
 * own peak; it cannot grow (a slightly negative fitted rate, within `maxGrowthDbPerS`, is
 * reported as 0 dB/s with no T60; so is a faster one whose rise stays within its measured
 * modulation's swing, riseWithinModulation, at the level the envelope swings about, with a warning naming it); its decay cannot be faster than `maxDecayDbPerS` nor
 * fall further over its track than the track stood over the noise (plus 30 dB of fit
 * slack); its frequency lies between `minFrequencyHz` (and clear of DC by half its
 * window's main lobe) and the Nyquist frequency; a reading too close to DC only because the
 * recording was too short for a longer window (spanNeededS) is named, with the length needed. A reading outside is a failed
 * measurement, so it is left out — with a warning — rather than reported. One exception:
 * an onset amplitude over the peak whose strongest frame lies within it is an envelope
 * that was not one exponential from the onset; its strongest frame's level is reported.
 */
export function guardPartials(partials: readonly TrackMeasurement[], bounds: PhysicalBounds): GuardedPartials {
  const kept: TrackMeasurement[] = []
  const counts = { amplitude: 0, growth: 0, decay: 0, frequency: 0, extrapolated: 0 }
  const swinging: TrackMeasurement[] = []
  const tooLowForSpan: number[] = []
  for (const original of partials) {
    let p = original
    if (p.amplitudeDb > bounds.peakDb + bounds.peakMarginDb && p.strongestFrameDb <= bounds.peakDb + bounds.peakMarginDb) {
      // The decay line, drawn back to the onset, overshoots: the envelope was not one
      // exponential from the onset (a two-stage decay, a slow attack). Its strongest frame
      // is what was seen.
      p = { ...p, amplitudeDb: p.strongestFrameDb }
      counts.extrapolated++
    }
    const lowestHz = Math.max(bounds.minFrequencyHz, MAIN_LOBE_BINS / 2 / p.windowS)
    if (p.frequencyHz >= bounds.minFrequencyHz && p.frequencyHz < lowestHz && spanNeededS(p.frequencyHz) > bounds.spanS) tooLowForSpan.push(p.frequencyHz)
    else if (!(p.frequencyHz >= lowestHz && p.frequencyHz < bounds.sampleRate / 2)) counts.frequency++
    else if (!(p.amplitudeDb <= bounds.peakDb + bounds.peakMarginDb)) counts.amplitude++
    else if (p.decayDbPerS < -bounds.maxGrowthDbPerS && riseWithinModulation(p)) {
      // Its level swings by modulationDepthDb about a middle level; the strongest frame is near the top.
      const level = Math.min(bounds.peakDb + bounds.peakMarginDb, p.strongestFrameDb - p.modulationDepthDb! / 2)
      swinging.push(p)
      kept.push({ ...p, decayDbPerS: 0, t60S: null, amplitudeDb: level })
    }
    else if (p.decayDbPerS < -bounds.maxGrowthDbPerS) counts.growth++
    else if (p.decayDbPerS > bounds.maxDecayDbPerS || !decayShownBySpan(p)) counts.decay++
    else kept.push(p.decayDbPerS < 0 ? { ...p, decayDbPerS: 0, t60S: null } : p)
  }
  const warnings: string[] = []
  const say = (n: number, why: string) => {
    if (n > 0) warnings.push(`${n} partial reading${n === 1 ? '' : 's'} left out: ${why}`)
  }
  say(counts.amplitude, 'amplitude above the recording\'s own peak level')
  if (counts.extrapolated > 0) {
    warnings.push(`${counts.extrapolated} partial${counts.extrapolated === 1 ? '' : 's'} did not decay as one exponential from the onset; amplitude given at the strongest frame instead`)
  }
  say(counts.growth, 'level growing instead of decaying')
  if (swinging.length > 0) {
    const named = swinging.map(p => `${p.frequencyHz.toFixed(2)} Hz (over ${(p.endS - p.startS).toFixed(2)} s)`).join(', ')
    warnings.push(`the decay of ${named} could not be read: the level swings with its modulation over the span measured, so it is given as 0 dB/s; a longer recording of the strike reads it`)
  }
  say(counts.decay, 'decay faster than the recording can show')
  say(counts.frequency, 'frequency outside the band the recording holds (or too close to 0 Hz for its window)')
  const advice = tooLowForSpan.length > 0 ? [tooShortToMeasure(tooLowForSpan, bounds.spanS)] : []
  return { kept, warnings, advice }
}

/** The readings a longer recording would measure, and how long it must be. */
function tooShortToMeasure(frequenciesHz: readonly number[], spanS: number): string {
  const sorted = [...frequenciesHz].sort((a, b) => a - b)
  const named = sorted.slice(0, 3).map(f => `${f.toFixed(2)} Hz`).join(', ') + (sorted.length > 3 ? ` and ${sorted.length - 3} more` : '')
  const neededS = Math.ceil(spanNeededS(sorted[0]!) * 10) / 10
  return `${named} ${sorted.length === 1 ? 'is' : 'are'} in the recording but could not be measured: the ${spanS.toFixed(2)} s after the strike is too short to tell so low a partial from 0 Hz; record at least ${neededS.toFixed(1)} s after the strike`
}
