import type { UniformBarMaterial } from './uniformBarF1Hz'
import { uniformBarLengthMm } from './uniformBarLengthMm'

/** One note of a range, with the uniform-bar length it needs and whether the blank is long enough. */
export interface NoteFromBlank {
  note: string
  targetHz: number
  lengthMm: number
  fits: boolean
}

/**
 * For each note of a range (lowest first), the length of a finished uniform bar of the blank's
 * thickness and measured material that sounds it as its first mode, and whether that length
 * lies within the blank's. A bar undercut in the middle needs less length for the same note,
 * so this is the cautious answer.
 */
export function notesFromBlank(
  notes: readonly { note: string, targetHz: number }[],
  blank: UniformBarMaterial & { lengthMm: number },
): NoteFromBlank[] {
  if (!(blank.lengthMm > 0)) throw new RangeError('the blank\'s length must be positive')
  return notes.map(({ note, targetHz }) => {
    const lengthMm = uniformBarLengthMm(targetHz, blank)
    return { note, targetHz, lengthMm, fits: lengthMm <= blank.lengthMm }
  })
}
