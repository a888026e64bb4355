import { annotatePartials } from './annotatePartials'
import type { BandSource } from './bandSource'
import type { PitchGlide } from './findPitchGlide'
import type { StrikeSpan } from './findStrike'
import { splitDoublets, type DoubletCandidate } from './splitDoublets'
import type { MeasuredPartial } from './types'

/** Partials with their second, independent reading, and warnings where the readings disagree. */
export interface CrossCheckedPartials {
  /** By ascending frequency. */
  partials: MeasuredPartial[]
  warnings: string[]
}

/**
 * The matrix pencil's part: two partials inside one main lobe are reported as two
 * (splitDoublets), and every other partial gets the cross-check and its uncertainty
 * (annotatePartials).
 */
export function crossCheckPartials(
  mono: Float64Array,
  sampleRate: number,
  fftPartials: readonly DoubletCandidate[],
  strike: StrikeSpan,
  level: { peakDb: number, peakMarginDb: number, minAmplitudeDb: number },
  /** Where the loudest sound glides (findPitchGlide): no doublet is split off there. */
  glide: PitchGlide | null = null,
  /** Decimated bands of `mono` (bandSource): the pencil's down-mixes start from them. */
  bands?: BandSource,
): CrossCheckedPartials {
  const doublets = splitDoublets(mono, sampleRate, fftPartials, {
    startIndex: strike.startIndex, endIndex: mono.length, onsetIndex: strike.onsetIndex, ...level, glide, bands,
  })
  const maxAmplitude = 10 ** ((level.peakDb + level.peakMarginDb) / 20)
  const annotated = annotatePartials(mono, sampleRate, doublets.single, { startIndex: strike.startIndex, endIndex: mono.length, maxAmplitude, bands })
  const partials: MeasuredPartial[] = [
    ...annotated.partials.map(({ windowS: _window, modulationFrom: _from, decayBendDbPerS: _bend, ...p }) => p),
    ...doublets.pairs,
  ].sort((a, b) => a.frequencyHz - b.frequencyHz)
  return { partials, warnings: annotated.warnings }
}
