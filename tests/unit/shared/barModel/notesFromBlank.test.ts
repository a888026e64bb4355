import { describe, expect, it } from 'vitest'
import { notesFromBlank } from '../../../../shared/barModel/notesFromBlank'
import { noteToFrequencyHz } from '../../../../shared/analysis/noteToFrequencyHz'

// from memory: a rosewood-like blank, E ≈ 20 GPa, ρ ≈ 1000 kg/m³, 22 mm thick, 450 mm long.
const BLANK = { lengthMm: 450, thicknessMm: 22, densityKgM3: 1000, youngsModulusGPa: 20 }
// source: ISO 16:1975, A4 = 440 Hz, equal temperament.
const RANGE = ['G4', 'A4', 'B4', 'C5'].map(note => ({ note, targetHz: noteToFrequencyHz(note) }))

describe('notesFromBlank', () => {
  it('lists the length each note needs and which fit in the blank', () => {
    const notes = notesFromBlank(RANGE, BLANK)
    // source: L = √((4.7300² / 2π f) · √(E t² / 12 ρ)) (Blevins, table 8-1), worked by hand:
    // G4 392.00 Hz → 507.9 mm, A4 440 Hz → 479.4 mm, B4 493.88 Hz → 452.5 mm, C5 523.25 Hz → 439.6 mm.
    expect(notes.map(n => n.note)).toEqual(['G4', 'A4', 'B4', 'C5'])
    expect(notes.map(n => Number(n.lengthMm.toFixed(1)))).toEqual([507.9, 479.4, 452.5, 439.6])
    expect(notes.map(n => n.fits)).toEqual([false, false, false, true])
  })

  it('lets every note of the range fit a long enough blank, and refuses a blank of no length', () => {
    expect(notesFromBlank(RANGE, { ...BLANK, lengthMm: 510 }).every(n => n.fits)).toBe(true)
    expect(() => notesFromBlank(RANGE, { ...BLANK, lengthMm: 0 })).toThrow(RangeError)
  })
})
