import { linkTracks } from './linkTracks'
import { measureTrack, type TrackMeasurement } from './measureTrack'
import type { ModulationSettings } from './measureModulation'
import type { AnalysisBand } from './planBands'
import { shortTimePeaks } from './shortTimePeaks'
import type { StrikeSpan } from './findStrike'

export interface BandSettings {
  peakThresholdDb: number
  noiseMarginDb: number
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
  trackJumpCents: number
  minTrackFrames: number
}

/**
 * One resolution of the analysis: short-time peaks in the band, tracks across frames
 * (through gaps as long as a tremolo's trough), and each track measured. Partials below
 * the band's own lower edge are left to the slower bands.
 */
export function measureBand(signal: Float64Array, sampleRate: number, strike: StrikeSpan, band: AnalysisBand, settings: BandSettings): BandMeasurement {
  const spectra = shortTimePeaks(signal, sampleRate, {
    windowLength: band.windowLength,
    fftSize: band.fftSize,
    hop: band.hop,
    startIndex: strike.startIndex,
    endIndex: Math.max(band.endIndex, Math.min(signal.length, strike.startIndex + band.windowLength)),
    peakThresholdDb: settings.peakThresholdDb,
    noiseMarginDb: settings.noiseMarginDb,
    minFrequencyHz: band.fromHz,
    maxFrequencyHz: band.toHz,
  })
  const trackJumpCents = Math.max(settings.minJumpCents, settings.glideCentsPerS * band.hopS)
  const minTrackFrames = Math.max(5, Math.ceil(band.windowLength / band.hop) + 2)
  const tracks = linkTracks(spectra, {
    maxJumpCents: trackJumpCents,
    minJumpHz: (0.5 * sampleRate) / band.windowLength,
    maxGapFrames: Math.max(1, Math.min(8, Math.round(settings.maxGapS / band.hopS))),
    minFrames: minTrackFrames,
  })
  const partials = tracks.flatMap(points =>
    measureTrack(points, signal, sampleRate, {
      onsetIndex: strike.onsetIndex,
      startIndex: strike.startIndex,
      endIndex: signal.length,
      windowLength: band.windowLength,
      fitMarginDb: settings.fitMarginDb,
      minSnrDb: settings.minSnrDb,
      maxRefineS: settings.maxRefineS,
      modulation: settings.modulation,
    }),
  ).filter(p => p.frequencyHz >= band.ownFromHz)
  return { partials, trackJumpCents, minTrackFrames }
}
