import { describe, expect, it } from 'vitest'
import { firstAtOrAbove } from '../../../../shared/analysis/firstAtOrAbove'

describe('firstAtOrAbove', () => {
  const list = [100, 200, 200, 200, 300].map(frequencyHz => ({ frequencyHz }))

  it('finds the first at or above, and the first strictly above, as a linear scan does', () => {
    for (const hz of [50, 100, 150, 200, 250, 300, 350]) {
      expect(firstAtOrAbove(list, hz), `${hz}`).toBe(list.findIndex(p => p.frequencyHz >= hz) === -1 ? list.length : list.findIndex(p => p.frequencyHz >= hz))
      expect(firstAtOrAbove(list, hz, true), `${hz} after`).toBe(list.findIndex(p => p.frequencyHz > hz) === -1 ? list.length : list.findIndex(p => p.frequencyHz > hz))
    }
  })

  it('gives 0 for an empty list', () => {
    expect(firstAtOrAbove([], 440)).toBe(0)
  })
})
