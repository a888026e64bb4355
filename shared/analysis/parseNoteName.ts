/** A parsed note name in scientific pitch notation (C4 = middle C, A4 = MIDI 69). */
export interface NoteName {
  letter: 'C' | 'D' | 'E' | 'F' | 'G' | 'A' | 'B'
  /** Semitones added by the accidentals: −2…+2. */
  accidental: number
  octave: number
  /** MIDI note number (may lie outside 0–127 for extreme octaves). */
  midi: number
}

const LETTER_SEMITONES = { C: 0, D: 2, E: 4, F: 5, G: 7, A: 9, B: 11 } as const

const ACCIDENTAL_SEMITONES: Record<string, number> = {
  '': 0, '#': 1, '♯': 1, 'b': -1, '♭': -1, '##': 2, 'x': 2, '𝄪': 2, 'bb': -2, '𝄫': -2,
}

/**
 * Parse a note name such as `C4`, `F#3`, `Bb2`, `A♭5` or `C-1` (scientific pitch
 * notation, ISO 16 / ASA convention: octave numbers change between B and C).
 * Returns null when the text is not a note name.
 */
export function parseNoteName(text: string): NoteName | null {
  const m = /^\s*([A-Ga-g])(##|bb|x|#|b|♯|♭|𝄪|𝄫)?(-?\d{1,2})\s*$/u.exec(text)
  if (!m) return null
  const letter = m[1]!.toUpperCase() as NoteName['letter']
  const accidental = ACCIDENTAL_SEMITONES[m[2] ?? '']!
  const octave = Number(m[3])
  if (octave < -1 || octave > 10) return null
  const midi = 12 * (octave + 1) + LETTER_SEMITONES[letter] + accidental
  return { letter, accidental, octave, midi }
}
