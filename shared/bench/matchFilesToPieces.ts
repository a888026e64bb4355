import { parseNoteName } from '../analysis/parseNoteName'

export interface PieceNote { id: string, note: string }

export interface FileMapping {
  fileName: string
  /** The note read from the file name, as written there (null when none was found). */
  note: string | null
  pieceId: string | null
  /** The piece's own spelling of the note (e.g. `F#5` for a file named `Gb5.wav`). */
  pieceNote: string | null
  /** Why the file cannot be sent, as a plain sentence; null when it maps to a piece. */
  problem: string | null
}

// A note name standing on its own in the name: not glued to a preceding letter
// ("take2" is not E2) nor to a following digit. The octave is required.
const NOTE_IN_NAME = /(?:^|[^A-Za-z])([A-Ga-g](?:##|bb|#|b|♯|♭|s(?=-?\d))?-?\d{1,2})(?![0-9])/gu

/** The first note name in a file name, e.g. `F#5` in `F#5-second-try.flac`; null when there is none. */
export function noteFromFileName(fileName: string): string | null {
  const base = fileName.replace(/^.*[\\/]/, '').replace(/\.[A-Za-z0-9]{1,5}$/, '')
  for (const m of base.matchAll(NOTE_IN_NAME)) {
    // "Cs4" is a common way to write C♯4 where "#" is awkward in a file name.
    const text = m[1]!.replace(/^([A-Ga-g])s/, '$1#')
    if (parseNoteName(text)) return text.charAt(0).toUpperCase() + text.slice(1)
  }
  return null
}

/**
 * Matches each file to the piece of a set whose note its name carries (enharmonic
 * spellings match: `Gb5.wav` goes to F♯5). Several files may go to one piece: each
 * becomes its own strike.
 */
export function matchFilesToPieces(fileNames: readonly string[], setPieces: readonly PieceNote[]): FileMapping[] {
  const byMidi = new Map<number, PieceNote>()
  for (const p of setPieces) {
    const parsed = parseNoteName(p.note)
    if (parsed && !byMidi.has(parsed.midi)) byMidi.set(parsed.midi, p)
  }
  return fileNames.map((fileName) => {
    const note = noteFromFileName(fileName)
    if (!note) return { fileName, note: null, pieceId: null, pieceNote: null, problem: 'No note in the file name; name it like C4.wav or F#5-second-try.flac.' }
    const piece = byMidi.get(parseNoteName(note)!.midi)
    if (!piece) return { fileName, note, pieceId: null, pieceNote: null, problem: `This set has no piece for ${note}.` }
    return { fileName, note, pieceId: piece.id, pieceNote: piece.note, problem: null }
  })
}
