import { AnalysisError } from './AnalysisError'
import { annotatePartials } from './annotatePartials'
import { chooseWindow } from './chooseWindow'
import { decideVerdict } from './decideVerdict'
import { checkLimits } from './decodeAudio'
import { findStrike } from './findStrike'
import { guidanceLines } from './guidanceLines'
import { inspectLevels } from './inspectLevels'
import { LIMITS } from './limits'
import { linkTracks } from './linkTracks'
import { matchTemplate } from './matchTemplate'
import { measureTrack, type TrackMeasurement } from './measureTrack'
import { mixToMono } from './mixToMono'
import { validateAnalyzeOptions } from './parseAnalyzeOptions'
import { resolveTarget } from './resolveTarget'
import { resolveTemplate } from './resolveTemplate'
import { roughPartialSpacing } from './roughPartialSpacing'
import { roundResult } from './roundResult'
import { shortTimePeaks } from './shortTimePeaks'
import type { AnalysisParameters, AnalysisResult, AnalyzeOptions, FftPartial, MeasuredPartial } from './types'
import { ENGINE_VERSION } from './version'

/** Fixed settings of engine 1.0.0 (stored in every result's `parameters`). */
const SETTINGS = {
  attackSkipS: 0.005,
  peakThresholdDb: 80,
  /** Lossy codecs leave artefacts 40–60 dB under the partials: report less range. */
  lossyRangeDb: 40,
  noiseMarginDb: 20,
  fitMarginDb: 15,
  minSnrDb: 25,
  maxRefineS: 2,
  glideCentsPerS: 200,
  minJumpCents: 10,
  /** A strike must stand this far over the recording's quiet parts, in dB. */
  minProminenceDb: 10,
  /** Shortest span analysed after the onset, in s. */
  minSpanS: 0.1,
} as const

/**
 * The whole measurement on decoded channels: level checks → mono → strike → window
 * choice → short-time peaks → partial tracks → per-partial measurement → template
 * match → verdict. Throws AnalysisError for audio that cannot be measured.
 */
export function analyzeChannels(
  channels: readonly ArrayLike<number>[],
  sampleRate: number,
  options: AnalyzeOptions = {},
  source: { lossy?: boolean } = {},
): AnalysisResult {
  const opts = validateAnalyzeOptions(options)
  const frames = channels[0]?.length ?? 0
  if (channels.length === 0) throw new AnalysisError(422, 'no_frames', 'The file holds no audio frames; the recording is empty.')
  checkLimits(channels.length, sampleRate, frames)
  const levels = inspectLevels(channels)
  if (levels.invalidSamples > 0) {
    throw new AnalysisError(415, 'corrupt_audio', 'The recording contains invalid sample values, so the file is damaged.')
  }
  if (levels.peak < LIMITS.silencePeak) {
    throw new AnalysisError(422, 'silent', 'The recording is silent; no strike can be heard in it.')
  }
  const warnings: string[] = []
  if (levels.clippedSamples > 0) warnings.push(`clipped samples: ${levels.clippedSamples}`)

  const mono = mixToMono(channels)
  let mean = 0
  for (let i = 0; i < mono.length; i++) mean += mono[i]!
  mean /= mono.length
  if (Math.abs(mean) > 0.01) warnings.push(`DC offset: ${mean.toFixed(3)} of full scale (removed before analysis)`)
  for (let i = 0; i < mono.length; i++) mono[i]! -= mean

  const attackSkipS = opts.attackSkipS ?? SETTINGS.attackSkipS
  const strike = findStrike(mono, sampleRate, { attackSkipS })
  if (strike.peakDb - strike.noiseFloorDb < SETTINGS.minProminenceDb) {
    // No quiet part to tell the strike from: the sound rings through the whole recording
    // (or there is no strike at all). Take the first loud sample as onset, analyse to the end.
    warnings.push('the sound never falls to a quiet background in this recording; analysed from its first loud moment to the end')
    const loud = 10 ** ((strike.peakDb - 30) / 20)
    let onset = 0
    while (onset < mono.length - 1 && Math.abs(mono[onset]!) <= loud) onset++
    strike.onsetIndex = onset
    strike.startIndex = Math.min(mono.length, onset + Math.round(attackSkipS * sampleRate))
    strike.endIndex = mono.length
  }
  const minSpan = Math.round(SETTINGS.minSpanS * sampleRate)
  if (strike.endIndex - strike.startIndex < minSpan) {
    strike.endIndex = Math.min(mono.length, strike.startIndex + minSpan)
    strike.startIndex = Math.max(0, Math.min(strike.startIndex, strike.endIndex - minSpan))
  }
  const spanS = (strike.endIndex - strike.startIndex) / sampleRate

  const target = resolveTarget(opts)
  const template = target ? resolveTemplate(opts) : null
  let windowFrom: AnalysisParameters['windowFrom']
  let spacingHz = Infinity
  let lowestHz = 100
  if (opts.windowS !== undefined) {
    windowFrom = 'option'
  }
  else if (target && template) {
    windowFrom = 'template'
    const expected = [...new Set(template.partials.map(p => p.ratio * target.fundamentalHz))].sort((a, b) => a - b)
    lowestHz = expected[0]!
    for (let i = 1; i < expected.length; i++) spacingHz = Math.min(spacingHz, expected[i]! - expected[i - 1]!)
  }
  else {
    const rough = roughPartialSpacing(mono, sampleRate, strike.startIndex, strike.endIndex)
    windowFrom = rough ? 'rough-pass' : 'default'
    if (rough) {
      spacingHz = rough.spacingHz
      lowestHz = rough.lowestHz
    }
  }
  const layout = chooseWindow({ spacingHz, lowestHz, spanS, windowS: opts.windowS }, sampleRate)

  const spectra = shortTimePeaks(mono, sampleRate, {
    windowLength: layout.windowLength,
    fftSize: layout.fftSize,
    hop: layout.hop,
    startIndex: strike.startIndex,
    endIndex: Math.max(strike.endIndex, Math.min(mono.length, strike.startIndex + layout.windowLength)),
    peakThresholdDb: SETTINGS.peakThresholdDb,
    noiseMarginDb: SETTINGS.noiseMarginDb,
    minFrequencyHz: 20,
    maxFrequencyHz: Math.min(20000, 0.475 * sampleRate),
  })
  const trackJumpCents = Math.max(SETTINGS.minJumpCents, SETTINGS.glideCentsPerS * layout.hopS)
  const minTrackFrames = Math.max(5, Math.ceil(layout.windowLength / layout.hop) + 2)
  const tracks = linkTracks(spectra, {
    maxJumpCents: trackJumpCents,
    minJumpHz: (0.5 * sampleRate) / layout.windowLength,
    maxGapFrames: 1,
    minFrames: minTrackFrames,
  })
  const measured = tracks.flatMap(points =>
    measureTrack(points, mono, sampleRate, {
      onsetIndex: strike.onsetIndex,
      startIndex: strike.startIndex,
      endIndex: mono.length,
      windowLength: layout.windowLength,
      fitMarginDb: SETTINGS.fitMarginDb,
      minSnrDb: SETTINGS.minSnrDb,
      maxRefineS: SETTINGS.maxRefineS,
    }),
  )
  const dynamicRangeDb = source.lossy ? SETTINGS.lossyRangeDb : SETTINGS.peakThresholdDb
  const strongest = Math.max(-Infinity, ...measured.map(m => m.amplitudeDb))
  const fftPartials: FftPartial[] = dropDuplicates(measured.filter(m => m.amplitudeDb >= strongest - dynamicRangeDb))
    .map(({ refineSpanS: _span, ...p }) => p)
  const annotated = annotatePartials(mono, sampleRate, fftPartials, { startIndex: strike.startIndex, endIndex: mono.length })
  const partials: MeasuredPartial[] = annotated.partials
  warnings.push(...annotated.warnings)
  if (source.lossy) warnings.push(`lossy audio format: partials more than ${dynamicRangeDb} dB under the strongest are not reported`)
  if (partials.length === 0) warnings.push('no partials found above the noise floor')

  const result: AnalysisResult = {
    engineVersion: ENGINE_VERSION,
    sampleRate,
    channels: channels.length,
    durationS: frames / sampleRate,
    onsetS: strike.onsetIndex / sampleRate,
    analysisStartS: strike.startIndex / sampleRate,
    analysisEndS: strike.endIndex / sampleRate,
    fundamentalHz: null,
    partials,
    verdict: null,
    guidance: [],
    warnings,
    parameters: {
      window: 'blackman-harris',
      windowS: layout.windowS,
      zeroPad: layout.zeroPad,
      hopS: layout.hopS,
      fftSize: layout.fftSize,
      attackSkipS,
      peakThresholdDb: SETTINGS.peakThresholdDb,
      dynamicRangeDb,
      noiseMarginDb: SETTINGS.noiseMarginDb,
      trackJumpCents,
      minTrackFrames,
      fitMarginDb: SETTINGS.fitMarginDb,
      refinement: 'long-window-dtft',
      maxRefineS: SETTINGS.maxRefineS,
      windowFrom,
    },
  }

  if (target && template) {
    const temperatureC = opts.temperatureC ?? null
    const matches = matchTemplate(partials, template, target.fundamentalHz, temperatureC)
    for (const m of matches) {
      if (m.targetHz >= sampleRate / 2) warnings.push(`${m.label} (${m.targetHz.toFixed(2)} Hz) lies above the highest frequency this recording can hold`)
      else if (m.missing) warnings.push(`no partial found near ${m.targetHz.toFixed(2)} Hz (${m.label})`)
    }
    result.target = target
    result.template = template
    result.temperatureC = temperatureC
    result.matches = matches
    result.fundamentalHz = matches.find(m => m.ratio === 1)?.measuredHz ?? null
    result.verdict = decideVerdict(matches)
    result.guidance = guidanceLines(matches)
  }
  else {
    result.fundamentalHz = strongestLowPartial(partials)?.frequencyHz ?? null
  }
  return roundResult(result)
}

/**
 * A partial can be tracked twice (a track that broke in a beat null and started again):
 * keep the longer track of any two closer than the resolution of their long windows.
 */
function dropDuplicates(measured: TrackMeasurement[]): TrackMeasurement[] {
  const byLength = [...measured].sort((a, b) => b.frames - a.frames || b.amplitudeDb - a.amplitudeDb)
  const kept: TrackMeasurement[] = []
  for (const m of byLength) {
    const clash = kept.some(k => Math.abs(k.frequencyHz - m.frequencyHz) < 1 / Math.min(k.refineSpanS, m.refineSpanS))
    if (!clash) kept.push(m)
  }
  return kept.sort((a, b) => a.frequencyHz - b.frequencyHz)
}

/** Without a target, the fundamental is taken as the lowest partial within 20 dB of the strongest. */
function strongestLowPartial(partials: MeasuredPartial[]): MeasuredPartial | undefined {
  if (partials.length === 0) return undefined
  const strongest = Math.max(...partials.map(p => p.amplitudeDb))
  return partials.find(p => p.amplitudeDb >= strongest - 20)
}
