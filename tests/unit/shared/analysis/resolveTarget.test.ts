import { describe, expect, it } from 'vitest'
import { resolveTarget } from '../../../../shared/analysis/resolveTarget'

describe('resolveTarget', () => {
  it('finds a note\'s frequency at A4 = 440 Hz unless told another reference', () => {
    expect(resolveTarget({ note: 'A4' })).toEqual({ fundamentalHz: 440, referenceHz: 440, note: 'A4' }) // source: ISO 16:1975
    expect(resolveTarget({ note: 'A3', referenceHz: 442 })).toEqual({ fundamentalHz: 221, referenceHz: 442, note: 'A3' })
    expect(resolveTarget({ note: ' C4 ' })!.fundamentalHz).toBeCloseTo(261.626, 3) // source: ISO 16:1975 with 12-TET, C4 = 261.626 Hz
  })

  it('prefers an explicit target frequency and keeps the note it was given', () => {
    expect(resolveTarget({ targetHz: 523, note: 'C5', referenceHz: 443 })).toEqual({ fundamentalHz: 523, referenceHz: 443, note: 'C5' })
  })

  it('has no target without a note or a frequency', () => {
    expect(resolveTarget({})).toBeNull()
    expect(resolveTarget({ note: '   ' })).toBeNull()
  })

  it('refuses a note name that is no note', () => {
    expect(() => resolveTarget({ note: 'H4' })).toThrow(RangeError)
  })
})
