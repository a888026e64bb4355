import { noteToFrequencyHz } from './noteToFrequencyHz'
import type { AnalyzeOptions } from './types'

/** The target of an analysis: fundamental, reference pitch and note (if any). */
export interface ResolvedTarget {
  fundamentalHz: number
  referenceHz: number
  note: string | null
}

/**
 * The target fundamental from the options: `targetHz` when given, else `note` in
 * twelve-tone equal temperament at `referenceHz` (default A4 = 440 Hz, ISO 16:1975).
 * Null when neither is given.
 */
export function resolveTarget(options: AnalyzeOptions): ResolvedTarget | null {
  const referenceHz = options.referenceHz ?? 440
  const note = options.note?.trim() || null
  if (options.targetHz !== undefined) return { fundamentalHz: options.targetHz, referenceHz, note }
  if (note) return { fundamentalHz: noteToFrequencyHz(note, referenceHz), referenceHz, note }
  return null
}
