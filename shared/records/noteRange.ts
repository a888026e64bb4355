import { parseNoteName } from '../analysis/parseNoteName'

const SHARP_NAMES = ['C', 'C#', 'D', 'D#', 'E', 'F', 'F#', 'G', 'G#', 'A', 'A#', 'B'] as const
const NATURAL = new Set([0, 2, 4, 5, 7, 9, 11])

/** MIDI note number of a note name (C4 = 60, A4 = 69). */
export function noteToMidi(note: string): number {
  const parsed = parseNoteName(note)
  if (!parsed) throw new Error(`"${note}" is not a note name (write it like C4, F#3 or Bb2).`)
  return parsed.midi
}

export function midiToNote(midi: number): string {
  const pitchClass = ((midi % 12) + 12) % 12
  return `${SHARP_NAMES[pitchClass]}${Math.floor(midi / 12) - 1}`
}

/**
 * The notes from `fromNote` to `toNote` inclusive, chromatic or naturals only,
 * lowest first. Throws a plain sentence when the range is backwards or too long.
 */
export function expandNoteRange(fromNote: string, toNote: string, chromatic: boolean, maxPieces = 120): string[] {
  const from = noteToMidi(fromNote)
  const to = noteToMidi(toNote)
  if (to < from) throw new Error(`The range runs backwards: ${toNote} is below ${fromNote}.`)
  const notes: string[] = []
  for (let m = from; m <= to; m++) {
    if (chromatic || NATURAL.has(((m % 12) + 12) % 12)) notes.push(midiToNote(m))
  }
  if (notes.length > maxPieces) throw new Error(`A set can hold at most ${maxPieces} pieces; this range has ${notes.length}.`)
  return notes
}
