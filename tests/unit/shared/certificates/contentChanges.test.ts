import { describe, expect, it } from 'vitest'
import { certificateChanges, readHeading } from '../../../../shared/certificates/contentChanges'
import { describeChanges } from '../../../../shared/schemas/setEdit'

const heading = (buyer: string, serial: string) => ({
  buyer: { name: buyer, organisation: 'Fernhill Community School', email: 'office@fernhill.example' },
  instrument: { name: 'Practice marimba', model: 'LM-2', serial },
})

describe('certificateChanges', () => {
  it('lists only the fields that differ, before and after', () => {
    const changes = certificateChanges(heading('Dana Whitcombe', 'LM2-7'), heading('Robin Ashdown', 'LM2-7'))
    expect(changes).toEqual([{ field: 'buyer', from: 'Dana Whitcombe', to: 'Robin Ashdown' }])
    expect(describeChanges(changes)).toBe('buyer: Dana Whitcombe → Robin Ashdown')
  })

  it('is empty for a re-issue that changed none of them', () => {
    expect(certificateChanges(heading('A', '1'), heading('A', '1'))).toEqual([])
  })
})

describe('readHeading', () => {
  it('reads the buyer and instrument of stored content, and null for content it cannot read', () => {
    expect(readHeading({ ...heading('A', '1'), pieces: 'anything else' })).toEqual(heading('A', '1'))
    expect(readHeading({ buyer: { name: 'A' } })).toBeNull()
    expect(readHeading(null)).toBeNull()
  })
})
