import { describe, expect, it } from 'vitest'
import { matchFilesToPieces, noteFromFileName } from '../../../../shared/bench/matchFilesToPieces'

describe('note in a file name', () => {
  it.each([
    ['C4.wav', 'C4'],
    ['F#5-second-try.flac', 'F#5'],
    ['Bb3_take2.ogg', 'Bb3'],
    ['marimba C#4 take 3.mp3', 'C#4'],
    ['Cs4.wav', 'C#4'],
    ['a2.WAV', 'A2'],
    ['strike-Eb-1.wav', 'Eb-1'],
  ])('%s → %s', (name, note) => {
    expect(noteFromFileName(name)).toBe(note)
  })

  it.each(['take2.wav', 'recording.wav', 'A440.wav', 'Bar.flac'])('%s has no note', (name) => {
    expect(noteFromFileName(name)).toBeNull()
  })
})

describe('matching files to the pieces of a set', () => {
  const pieces = [{ id: 'p1', note: 'C4' }, { id: 'p2', note: 'C#4' }, { id: 'p3', note: 'F#5' }]

  it('maps by note, with enharmonic spellings, and says why a file has no piece', () => {
    const out = matchFilesToPieces(['C4.wav', 'Db4-retry.wav', 'Gb5.flac', 'D4.wav', 'noise.wav'], pieces)
    expect(out.map(o => o.pieceId)).toEqual(['p1', 'p2', 'p3', null, null])
    expect(out[2]!.pieceNote).toBe('F#5')
    expect(out[3]!.problem).toBe('This set has no piece for D4.')
    expect(out[4]!.problem).toMatch(/No note in the file name/)
  })

  it('lets several files go to one piece', () => {
    const out = matchFilesToPieces(['F#5.wav', 'F#5-second-try.flac'], pieces)
    expect(out.every(o => o.pieceId === 'p3')).toBe(true)
  })
})
