import { parseNoteName } from './parseNoteName'

/**
 * Frequency in Hz of a note in twelve-tone equal temperament with A4 = `referenceHz`
 * (ISO 16:1975 sets A4 = 440 Hz): f = referenceHz · 2^((midi − 69) / 12).
 * Throws RangeError on a name that is not a note or a non-positive reference.
 */
export function noteToFrequencyHz(note: string, referenceHz = 440): number {
  if (!(referenceHz > 0)) throw new RangeError('referenceHz must be positive')
  const parsed = parseNoteName(note)
  if (!parsed) throw new RangeError(`"${note}" is not a note name such as C4 or F#3`)
  return referenceHz * 2 ** ((parsed.midi - 69) / 12)
}
