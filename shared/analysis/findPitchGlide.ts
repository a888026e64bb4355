import { centsBetween } from './centsBetween'
import type { SpectralPeak, SpectrumFrame } from './shortTimePeaks'

export interface PitchGlideSettings {
  /** Largest step from one frame to the next the path follows, cents. */
  maxStepCents: number
  /** The path ends where its level has fallen this far under its start, dB. */
  spanDb: number
  /** A glide moves at least this far (3-frame medians at either end or in between), cents. */
  minGlideCents: number
  /** Frames, and seconds, the path must last. */
  minFrames: number
  minDurationS: number
}

/** The loudest sound of a strike, followed from frame to frame, where its pitch moves by a glide's worth. */
export interface PitchGlide {
  fromHz: number
  toHz: number
  /** The highest and lowest pitch on the way (3-frame medians), Hz. */
  highestHz: number
  lowestHz: number
  startS: number
  endS: number
}

const DEFAULTS: PitchGlideSettings = { maxStepCents: 150, spanDb: 30, minGlideCents: 100, minFrames: 5, minDurationS: 0.1 }

/**
 * The strongest spectral peak of the strike followed forward frame by frame — the nearest
 * peak within `maxStepCents`, no more than 3 dB louder than the last (a decaying sound
 * does not jump up to a neighbour) — until its level has fallen `spanDb`; a glide when the
 * 3-frame running median of its pitch spans `minGlideCents` or more. A struck bar, bell or
 * plate holds its pitch to a few cents; a drum head struck hard (tension rises with the
 * amplitude, so the pitch falls as it rings) or pressed while it rings glides by semitones,
 * and no single partial stands for that sound. Null when the loudest sound holds still.
 */
export function findPitchGlide(frames: readonly SpectrumFrame[], settings: PitchGlideSettings = DEFAULTS): PitchGlide | null {
  const loudest = loudestPeak(frames)
  if (!loudest) return null
  const { peak: start, frame: startFrame } = loudest
  const path = [{ timeS: frames[startFrame]!.timeS, frequencyHz: start.frequencyHz, amplitudeDb: start.amplitudeDb }]
  for (let i = startFrame + 1; i < frames.length; i++) {
    const last = path[path.length - 1]!
    let next: (typeof path)[number] | null = null
    for (const peak of frames[i]!.peaks) {
      const stepCents = Math.abs(centsBetween(last.frequencyHz, peak.frequencyHz))
      if (stepCents > settings.maxStepCents || peak.amplitudeDb > last.amplitudeDb + 3) continue
      if (!next || stepCents < Math.abs(centsBetween(last.frequencyHz, next.frequencyHz))) next = { timeS: frames[i]!.timeS, ...peak }
    }
    if (!next || next.amplitudeDb < start.amplitudeDb - settings.spanDb) break
    path.push(next)
  }
  if (path.length < settings.minFrames || path[path.length - 1]!.timeS - path[0]!.timeS < settings.minDurationS) return null
  const median = path.map((_, i) => {
    const near = path.slice(Math.max(0, i - 1), i + 2).map(p => p.frequencyHz).sort((a, b) => a - b)
    return near[near.length >> 1]!
  })
  const highestHz = Math.max(...median)
  const lowestHz = Math.min(...median)
  if (centsBetween(highestHz, lowestHz) < settings.minGlideCents) return null
  return { fromHz: median[0]!, toHz: median[median.length - 1]!, highestHz, lowestHz, startS: path[0]!.timeS, endS: path[path.length - 1]!.timeS }
}

/** The strongest spectral peak over all the frames (the strike's loudest sound) and its frame's index, or null when there is none. */
export function loudestPeak(frames: readonly SpectrumFrame[]): { peak: SpectralPeak, frame: number } | null {
  let loudest: { peak: SpectralPeak, frame: number } | null = null
  frames.forEach((frame, i) => {
    for (const peak of frame.peaks) if (!loudest || peak.amplitudeDb > loudest.peak.amplitudeDb) loudest = { peak, frame: i }
  })
  return loudest
}

/** How far past a glide's course a reading still lies on it, as a frequency ratio (50 ¢: its ends are 3-frame medians). */
const COURSE_MARGIN = 2 ** (50 / 1200)

/** Whether a reading lies on a glide's course (between its lowest and highest pitch, 50 ¢ either side). */
export function onGlideCourse(glide: PitchGlide | null, frequencyHz: number): boolean {
  return glide !== null && frequencyHz >= glide.lowestHz / COURSE_MARGIN && frequencyHz <= glide.highestHz * COURSE_MARGIN
}

/**
 * Readings that one track gave as a close pair (modulationFrom 'pair') on a glide's course are
 * the glide read as two decaying components, not two modes: only the one nearest where the
 * glide settles stays, as a single reading (no beat, no pair's modulation).
 */
export function dropPairsOnGlide<P extends { frequencyHz: number, beatHz: number | null, modulationHz: number | null, modulationDepthDb: number | null, modulationFrom: string | null }>(
  partials: readonly P[],
  glide: PitchGlide | null,
): P[] {
  const paired = partials.filter(p => p.modulationFrom === 'pair' && onGlideCourse(glide, p.frequencyHz))
  if (!glide || paired.length < 2) return [...partials]
  const settled = paired.reduce((a, b) => (Math.abs(centsBetween(b.frequencyHz, glide.toHz)) < Math.abs(centsBetween(a.frequencyHz, glide.toHz)) ? b : a))
  return partials
    .filter(p => p === settled || !paired.includes(p))
    .map(p => (p === settled ? { ...p, beatHz: null, modulationHz: null, modulationDepthDb: null, modulationFrom: null } : p))
}

/** The Bench's sentence for a glide, saying whether a reported partial holds where it settles, or only averages the glide. */
export function pitchGlideWarning(glide: PitchGlide | null, reportedHz: readonly number[]): string | null {
  if (!glide) return null
  const hz = (f: number) => `${f.toFixed(1)} Hz`
  const via = [glide.highestHz, glide.lowestHz].filter(f => Math.abs(centsBetween(f, glide.fromHz)) >= 50 && Math.abs(centsBetween(f, glide.toHz)) >= 50)
  const course = [hz(glide.fromHz), ...via.map(hz), hz(glide.toHz)].join(' to ')
  const head = `The loudest sound of the strike glides in pitch, from ${course} over ${(glide.endS - glide.startS).toFixed(2)} s (as a drum head does when struck hard or pressed while it rings)`
  const settled = reportedHz.find(f => Math.abs(centsBetween(f, glide.toHz)) <= 50)
  if (settled !== undefined) return `${head}; it is reported where it settles, at ${hz(settled)}`
  const midway = reportedHz.find(f => onGlideCourse(glide, f))
  if (midway !== undefined) return `${head}; the reading at ${hz(midway)} is an average over the glide, not a pitch the piece holds. Strike again, not too hard, and let it ring free`
  return `${head}, and is not reported: it holds no single pitch to measure. Strike again, not too hard, and let it ring free`
}
