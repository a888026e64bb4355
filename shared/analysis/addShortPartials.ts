import { ENGINE_SETTINGS as S } from './engineSettings'
import type { ExpectedPartials } from './expectedPartials'
import type { StrikeSpan } from './findStrike'
import { findShortPartials } from './findShortPartials'
import { templateSearchWindows } from './templateSearchWindows'
import type { MeasuredPartial } from './types'

/** The partials with the short-lived ones added, and a warning for each added one. */
export interface WithShortPartials {
  /** By ascending frequency. */
  partials: MeasuredPartial[]
  warnings: string[]
}

/**
 * With a template: template partials the tracks missed, looked for in the first tens of
 * milliseconds after the attack (findShortPartials) inside the template's search windows.
 * Without one the partials come back as they were.
 */
export function addShortPartials(
  mono: Float64Array,
  sampleRate: number,
  partials: readonly MeasuredPartial[],
  expected: ExpectedPartials,
  strike: StrikeSpan,
  level: { peakDb: number, minAmplitudeDb: number },
): WithShortPartials {
  const { template, expectedHz } = expected
  if (!template || !expectedHz) return { partials: [...partials], warnings: [] }
  const windows = templateSearchWindows(expectedHz, template.searchWindowCents)
  const wanted = template.partials.map((spec, i) => ({ label: spec.label, targetHz: expectedHz[i]!, windowCents: windows[i]! }))
  const short = findShortPartials(mono, sampleRate, partials, wanted, {
    startIndex: strike.startIndex,
    endIndex: mono.length,
    onsetIndex: strike.onsetIndex,
    maxAmplitudeDb: level.peakDb + S.peakMarginDb,
    minAmplitudeDb: level.minAmplitudeDb,
    maxDecayDbPerS: S.maxDecayDbPerS,
  })
  return { partials: [...partials, ...short.partials].sort((a, b) => a.frequencyHz - b.frequencyHz), warnings: short.warnings }
}
