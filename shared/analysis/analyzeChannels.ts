import { analysisParameters } from './analysisParameters'
import { annotatePartials } from './annotatePartials'
import { applyTemplate } from './applyTemplate'
import { chooseWindow } from './chooseWindow'
import { dropDuplicates } from './dropDuplicates'
import { dropSidebands } from './dropSidebands'
import { dropSpuriousPartials } from './dropSpuriousPartials'
import { ENGINE_SETTINGS as S } from './engineSettings'
import { findShortPartials } from './findShortPartials'
import { fundamentalWithoutTarget } from './fundamentalWithoutTarget'
import { guardPartials } from './guardPartials'
import { locateStrike } from './locateStrike'
import { measureAllBands } from './measureAllBands'
import { validateAnalyzeOptions } from './parseAnalyzeOptions'
import { planBands } from './planBands'
import { prepareMono } from './prepareMono'
import { resolveTarget } from './resolveTarget'
import { resolveTemplate } from './resolveTemplate'
import { roundResult } from './roundResult'
import { splitDoublets, type DoubletCandidate } from './splitDoublets'
import { templateSearchWindows } from './templateSearchWindows'
import type { AnalysisResult, AnalyzeOptions, MeasuredPartial } from './types'
import { ENGINE_VERSION } from './version'
import { windowNeedsFor } from './windowNeedsFor'

/**
 * The whole measurement on decoded channels: level checks → mono → strike → window needs
 * (rough pass and template) → bands of several resolutions → per band: short-time peaks,
 * tracks, per-partial measurement → merge → physical bounds → template match → verdict.
 * Throws AnalysisError for audio that cannot be measured.
 */
export function analyzeChannels(
  channels: readonly ArrayLike<number>[],
  sampleRate: number,
  options: AnalyzeOptions = {},
  source: { lossy?: boolean } = {},
): AnalysisResult {
  const opts = validateAnalyzeOptions(options)
  const { mono, peak, warnings } = prepareMono(channels, sampleRate)
  const attackSkipS = opts.attackSkipS ?? S.attackSkipS
  const strike = locateStrike(mono, sampleRate, { attackSkipS, minProminenceDb: S.minProminenceDb, minSpanS: S.minSpanS }, warnings)
  const spanS = (strike.endIndex - strike.startIndex) / sampleRate

  const target = resolveTarget(opts)
  const template = target ? resolveTemplate(opts) : null
  const expectedHz = target && template ? template.partials.map(p => p.ratio * target.fundamentalHz) : null
  const needs = windowNeedsFor(mono, sampleRate, strike, expectedHz, opts.windowS !== undefined)
  const long = chooseWindow({ spacingHz: needs.spacingHz, lowestHz: needs.lowestHz, spanS, windowS: opts.windowS }, sampleRate)
  const range = { minHz: 20, maxHz: Math.min(20000, 0.475 * sampleRate) }
  const bands = opts.windowS !== undefined
    ? planBands(long, [], sampleRate, strike, range, { ...S, shortestWindowS: Infinity })
    : planBands(long, needs.neighbourLists, sampleRate, strike, range, S)

  const { measured, merged } = measureAllBands(mono, sampleRate, strike, bands, S)
  const guarded = guardPartials(merged, {
    peakDb: 20 * Math.log10(peak),
    peakMarginDb: S.peakMarginDb,
    sampleRate,
    minFrequencyHz: range.minHz,
    maxDecayDbPerS: S.maxDecayDbPerS,
    maxGrowthDbPerS: S.maxGrowthDbPerS,
  })
  warnings.push(...guarded.warnings)
  const dynamicRangeDb = source.lossy ? S.lossyRangeDb : S.peakThresholdDb
  const strongest = Math.max(-Infinity, ...guarded.kept.map(m => m.amplitudeDb))
  const honest = dropSpuriousPartials(dropDuplicates(dropSidebands(guarded.kept.filter(m => m.amplitudeDb >= strongest - dynamicRangeDb))), { strongestDb: strongest, ...S.spurious })
  warnings.push(...honest.warnings)
  const fftPartials: DoubletCandidate[] = honest.kept
    .map(({ refineSpanS: _span, strongestFrameDb: _frame, ...p }) => p)
  // Two partials inside one main lobe are reported as two, read by the matrix pencil.
  const doublets = splitDoublets(mono, sampleRate, fftPartials, {
    startIndex: strike.startIndex, endIndex: mono.length, onsetIndex: strike.onsetIndex, peakDb: 20 * Math.log10(peak), peakMarginDb: S.peakMarginDb, minAmplitudeDb: strongest - dynamicRangeDb,
  })
  // The second, independent reading of every partial: cross-check and uncertainty.
  const annotated = annotatePartials(mono, sampleRate, doublets.single, { startIndex: strike.startIndex, endIndex: mono.length })
  const partials: MeasuredPartial[] = [
    ...annotated.partials.map(({ windowS: _window, modulationFrom: _from, ...p }) => p),
    ...doublets.pairs,
  ].sort((a, b) => a.frequencyHz - b.frequencyHz)
  warnings.push(...annotated.warnings)
  if (template && expectedHz) {
    // Template partials the tracks missed, looked for in the first tens of ms after the attack.
    const windows = templateSearchWindows(expectedHz, template.searchWindowCents)
    const expected = template.partials.map((spec, i) => ({ label: spec.label, targetHz: expectedHz[i]!, windowCents: windows[i]! }))
    const short = findShortPartials(mono, sampleRate, partials, expected, {
      startIndex: strike.startIndex, endIndex: mono.length, onsetIndex: strike.onsetIndex,
      maxAmplitudeDb: 20 * Math.log10(peak) + S.peakMarginDb, minAmplitudeDb: strongest - dynamicRangeDb, maxDecayDbPerS: S.maxDecayDbPerS,
    })
    partials.push(...short.partials)
    partials.sort((a, b) => a.frequencyHz - b.frequencyHz)
    warnings.push(...short.warnings)
  }
  if (source.lossy) warnings.push(`lossy audio format: partials more than ${dynamicRangeDb} dB under the strongest are not reported`)
  if (partials.length === 0) warnings.push('no partials found above the noise floor')

  const result: AnalysisResult = {
    engineVersion: ENGINE_VERSION,
    sampleRate,
    channels: channels.length,
    durationS: mono.length / sampleRate,
    onsetS: strike.onsetIndex / sampleRate,
    analysisStartS: strike.startIndex / sampleRate,
    analysisEndS: strike.endIndex / sampleRate,
    fundamentalHz: null,
    partials,
    verdict: null,
    guidance: [],
    warnings,
    parameters: analysisParameters(bands, measured, sampleRate, { attackSkipS, dynamicRangeDb, windowFrom: needs.windowFrom }),
  }
  if (target && template) applyTemplate(result, partials, target, template, opts.temperatureC ?? null)
  else result.fundamentalHz = fundamentalWithoutTarget(partials)?.frequencyHz ?? null
  return roundResult(result)
}
