import { describe, expect, it } from 'vitest'
import { BLANK_THRESHOLDS } from '../../../../shared/barModel/blankThresholds'
import { gradeFromThresholds } from '../../../../shared/barModel/gradeFromThresholds'

const rosewood = BLANK_THRESHOLDS.rosewood

describe('gradeFromThresholds', () => {
  it('ranks a blank by the worse of its stiffness and its loss', () => {
    expect(gradeFromThresholds({ specificModulus: rosewood.specificModulus.select, lossFactor: rosewood.lossFactor.select }, 'rosewood'))
      .toEqual({ species: 'rosewood', rank: 'select', reasons: [], thresholds: rosewood, source: 'starting' })
    const stiffButLossy = gradeFromThresholds({ specificModulus: 30, lossFactor: (rosewood.lossFactor.select + rosewood.lossFactor.usable) / 2 }, 'rosewood')
    expect(stiffButLossy.rank).toBe('usable')
    expect(stiffButLossy.reasons).toEqual([expect.stringMatching(/^A loss factor of 0\.0100 is above the select limit of 0\.0080 for rosewood\.$/)])
    expect(gradeFromThresholds({ specificModulus: rosewood.specificModulus.usable - 0.1, lossFactor: 0.001 }, 'rosewood').rank).toBe('reject')
  })

  it('judges stiffness alone without a decay, and says so', () => {
    const g = gradeFromThresholds({ specificModulus: 20, lossFactor: null }, 'rosewood')
    expect(g.rank).toBe('usable')
    expect(g.reasons).toContain('No decay was given, so the loss factor was not judged.')
    expect(() => gradeFromThresholds({ specificModulus: Number.NaN, lossFactor: null }, 'rosewood')).toThrow(RangeError)
  })

  it('uses the workshop\'s own figures for a species it stored, and the starting ones for the others', () => {
    const strict = { specificModulus: { select: 26, usable: 21 }, lossFactor: { select: 0.006, usable: 0.009 } }
    const figures = { specificModulus: 20, lossFactor: 0.007 }
    // E/ρ 20 is usable by the starting rosewood figures (17–22) but a reject below the workshop's usable 21.
    expect(gradeFromThresholds(figures, 'rosewood')).toMatchObject({ rank: 'usable', source: 'starting' })
    expect(gradeFromThresholds(figures, 'rosewood', { rosewood: strict })).toMatchObject({ rank: 'reject', source: 'workshop', thresholds: strict })
    expect(gradeFromThresholds({ specificModulus: 15, lossFactor: 0.012 }, 'padauk', { rosewood: strict })).toMatchObject({ rank: 'usable', source: 'starting', thresholds: BLANK_THRESHOLDS.padauk })
  })
})
