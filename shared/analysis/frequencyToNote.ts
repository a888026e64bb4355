/** The equal-tempered note nearest to a frequency, and the deviation from it. */
export interface NearestNote {
  /** Name with sharps, e.g. `C#4`. */
  note: string
  midi: number
  /** Frequency of that note in Hz at the given reference. */
  noteHz: number
  /** Deviation of the frequency from the note, in cents (−50…+50). */
  cents: number
}

const NAMES = ['C', 'C#', 'D', 'D#', 'E', 'F', 'F#', 'G', 'G#', 'A', 'A#', 'B'] as const

/**
 * Nearest twelve-tone equal-tempered note to `frequencyHz` with A4 = `referenceHz`.
 */
export function frequencyToNote(frequencyHz: number, referenceHz = 440): NearestNote {
  if (!(frequencyHz > 0) || !(referenceHz > 0)) throw new RangeError('frequencyToNote needs positive frequencies')
  const exactMidi = 69 + 12 * Math.log2(frequencyHz / referenceHz)
  const midi = Math.round(exactMidi)
  const noteHz = referenceHz * 2 ** ((midi - 69) / 12)
  const name = NAMES[((midi % 12) + 12) % 12]!
  const octave = Math.floor(midi / 12) - 1
  return { note: `${name}${octave}`, midi, noteHz, cents: 1200 * Math.log2(frequencyHz / noteHz) }
}
