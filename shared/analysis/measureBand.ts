import { checkWorkDeadline } from './workDeadline'
import { linkTracks, type TrackPoint } from './linkTracks'
import { measureTrack, type TrackMeasurement } from './measureTrack'
import type { ModulationSettings } from './measureModulation'
import type { AnalysisBand } from './planBands'
import type { BandSource } from './bandSource'
import { shortTimePeaks, type SpectrumFrame } from './shortTimePeaks'
import type { StrikeSpan } from './findStrike'
import type { ReportFloor } from './reportFloor'

/** Tracks measured first, strongest first, so the reporting floor is known before the rest. */
const FLOOR_SETTERS = 4

export interface BandSettings {
  peakThresholdDb: number
  noiseMarginDb: number
  /** How far the noise floor may fall under the banded one to what later frames show, dB (trailingFloor). */
  maxFloorReliefDb?: number
  glideCentsPerS: number
  minJumpCents: number
  maxGapS: number
  fitMarginDb: number
  minSnrDb: number
  maxRefineS: number
  modulation: ModulationSettings
}

/** Partials of one band, with the tracking settings that were used. */
export interface BandMeasurement {
  partials: TrackMeasurement[]
  /** The band's short-time spectra (their peaks), frame by frame. */
  frames: SpectrumFrame[]
  trackJumpCents: number
  minTrackFrames: number
}

/**
 * One resolution of the analysis: short-time peaks in the band, tracks across frames
 * (through gaps as long as a tremolo's trough), and each track measured. Partials below
 * the band's own lower edge are left to the slower bands, and tracks `settled` says the
 * slower bands already hold are not measured at all. The strongest tracks are measured
 * first, so the reporting floor (`floor`) is known early and weak tracks far under it cost little;
 * the partials come back in the tracks' own order.
 */
export function measureBand(
  signal: Float64Array,
  sampleRate: number,
  strike: StrikeSpan,
  band: AnalysisBand,
  settings: BandSettings,
  /** Tracks this says are settled elsewhere are not measured (the costly step). */
  settled: (points: TrackPoint[]) => boolean = () => false,
  bands?: BandSource,
  floor?: ReportFloor,
): BandMeasurement {
  const spectra = shortTimePeaks(signal, sampleRate, {
    windowLength: band.windowLength,
    fftSize: band.fftSize,
    hop: band.hop,
    startIndex: strike.startIndex,
    endIndex: Math.max(band.endIndex, Math.min(signal.length, strike.startIndex + band.windowLength)),
    peakThresholdDb: settings.peakThresholdDb,
    noiseMarginDb: settings.noiseMarginDb,
    maxFloorReliefDb: settings.maxFloorReliefDb,
    minFrequencyHz: band.fromHz,
    maxFrequencyHz: band.toHz,
  })
  const trackJumpCents = Math.max(settings.minJumpCents, settings.glideCentsPerS * band.hopS)
  // A track spans more than one window of independent frames (rounding of the hop aside).
  const minTrackFrames = Math.max(5, Math.ceil(band.windowLength / band.hop - 0.01) + 2)
  const tracks = linkTracks(spectra, {
    maxJumpCents: trackJumpCents,
    minJumpHz: (0.5 * sampleRate) / band.windowLength,
    maxGapFrames: Math.max(1, Math.min(8, Math.round(settings.maxGapS / band.hopS))),
    minFrames: minTrackFrames,
  })
  const kept = tracks.filter(points => !settled(points))
  const strongest = kept.map(points => points.reduce((top, p) => Math.max(top, p.amplitudeDb), -Infinity))
  // The few strongest set the floor; the rest keep their order (neighbouring tracks share long spans).
  const first = kept.map((_, i) => i).sort((a, b) => strongest[b]! - strongest[a]!).slice(0, FLOOR_SETTERS)
  const byLevel = [...first, ...kept.map((_, i) => i).filter(i => !first.includes(i))]
  const readings: TrackMeasurement[][] = []
  for (const i of byLevel) {
    checkWorkDeadline()
    readings[i] = measureTrack(kept[i]!, signal, sampleRate, {
      onsetIndex: strike.onsetIndex,
      startIndex: strike.startIndex,
      endIndex: signal.length,
      windowLength: band.windowLength,
      fitMarginDb: settings.fitMarginDb,
      minSnrDb: settings.minSnrDb,
      maxRefineS: settings.maxRefineS,
      modulation: settings.modulation,
      bands,
      reportFloorDb: floor?.levelDb(),
    })
    floor?.note(readings[i].filter(p => p.frequencyHz >= band.ownFromHz))
  }
  const partials = readings.flat().filter(p => p.frequencyHz >= band.ownFromHz)
  return { partials, frames: spectra, trackJumpCents, minTrackFrames }
}
