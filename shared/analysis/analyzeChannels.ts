import { LIMITS } from './limits'
import { startWorkDeadline } from './workDeadline'
import { addLongLookPartials } from './addLongLookPartials'
import { addShortPartials } from './addShortPartials'
import { applyTemplate } from './applyTemplate'
import { assembleResult } from './assembleResult'
import { correctPartialsHz } from '../calibration/correctPartialsHz'
import { crossCheckPartials } from './crossCheckPartials'
import { bandSource } from './bandSource'
import { ENGINE_SETTINGS as S } from './engineSettings'
import { expectedPartials } from './expectedPartials'
import { fundamentalWithoutTarget } from './fundamentalWithoutTarget'
import { locateStrike } from './locateStrike'
import { measureFftPartials } from './measureFftPartials'
import { validateAnalyzeOptions } from './parseAnalyzeOptions'
import { planAnalysis } from './planAnalysis'
import { prepareMono } from './prepareMono'
import { roundResult } from './roundResult'
import type { AnalysisResult, AnalyzeOptions } from './types'

/**
 * The whole measurement on decoded channels, as a sequence of steps that each return new
 * values: level checks → mono → strike → window needs and bands → the FFT path's partials
 * (tracks, per-partial measurement, merge, physical bounds, reported range) → doublets and
 * the cross-check → close partials of the long look → short-lived template partials → result → template match and verdict.
 * Throws AnalysisError for audio that cannot be measured.
 */
export function analyzeChannels(
  channels: readonly ArrayLike<number>[],
  sampleRate: number,
  options: AnalyzeOptions = {},
  /** What the container says: a lossy codec, or integer PCM of this many bits (coarse ones show less range). */
  source: { lossy?: boolean, pcmBits?: number | null } = {},
): AnalysisResult {
  const lift = startWorkDeadline(LIMITS.maxMeasureS)
  try {
    return measureChannels(channels, sampleRate, options, source)
  }
  finally {
    lift()
  }
}

/** analyzeChannels' steps, under its time limit. */
function measureChannels(
  channels: readonly ArrayLike<number>[],
  sampleRate: number,
  options: AnalyzeOptions,
  source: { lossy?: boolean, pcmBits?: number | null },
): AnalysisResult {
  const opts = validateAnalyzeOptions(options)
  const prepared = prepareMono(channels, sampleRate)
  const { mono, peakDb } = prepared
  const attackSkipS = opts.attackSkipS ?? S.attackSkipS
  const located = locateStrike(mono, sampleRate, { attackSkipS, minProminenceDb: S.minProminenceDb, minSpanS: S.minSpanS })
  const { strike } = located
  const expected = expectedPartials(opts)
  const plan = planAnalysis(mono, sampleRate, strike, expected.expectedHz, opts.windowS)
  // One DFT of the signal, and bands decimated from it, shared by the FFT path and the cross-check.
  const bands = bandSource(mono, sampleRate)
  const fft = measureFftPartials(mono, sampleRate, strike, plan, { peakDb, lossy: source.lossy === true, pcmBits: source.pcmBits ?? null }, bands)
  const level = { peakDb, peakMarginDb: S.peakMarginDb, minAmplitudeDb: fft.minAmplitudeDb }
  const checked = crossCheckPartials(mono, sampleRate, fft.partials, strike, level, fft.glide, bands)
  const withLong = addLongLookPartials(mono, sampleRate, checked.partials, strike, plan, level)
  const withShort = addShortPartials(mono, sampleRate, withLong.partials, expected, strike, level)
  // The clock correction comes before matching, so cents and verdicts are on the reference's scale.
  const partials = opts.clockOffsetPpm === undefined ? withShort.partials : correctPartialsHz(withShort.partials, opts.clockOffsetPpm)
  // About the recording itself and what to do about it first; then how the measurement went.
  const advice = [
    ...prepared.warnings,
    ...located.warnings,
    ...(source.lossy ? [`lossy audio format: partials more than ${fft.dynamicRangeDb} dB under the strongest are not reported`] : []),
    ...(!source.lossy && fft.dynamicRangeDb < S.peakThresholdDb
      ? [`${source.pcmBits}-bit audio: partials more than ${fft.dynamicRangeDb} dB under the strongest are not reported (the format's own quantisation error)`]
      : []),
    ...(partials.length === 0 ? ['no partials found above the noise floor'] : []),
    ...fft.advice,
  ]
  const warnings = [...advice, ...fft.warnings, ...checked.warnings, ...withLong.warnings, ...withShort.warnings]
  const assembled = assembleResult(partials, { warnings, advice }, {
    sampleRate, channels: channels.length, samples: mono.length, strike, plan, measured: fft.measured, attackSkipS, dynamicRangeDb: fft.dynamicRangeDb,
  })
  const result = opts.clockOffsetPpm === undefined ? assembled : { ...assembled, parameters: { ...assembled.parameters, clockOffsetPpm: opts.clockOffsetPpm } }
  const { target, template } = expected
  return roundResult(target && template
    ? applyTemplate(result, partials, target, template, opts.temperatureC ?? null)
    : { ...result, fundamentalHz: fundamentalWithoutTarget(partials)?.frequencyHz ?? null })
}
