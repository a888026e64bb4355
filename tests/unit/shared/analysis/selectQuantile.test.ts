import { describe, expect, it } from 'vitest'
import { selectQuantile } from '../../../../shared/analysis/selectQuantile'
import { seededRandom } from '../../../support/seededRandom'

describe('selectQuantile', () => {
  it('agrees with sorting and leaves its input alone', () => {
    const random = seededRandom(3)
    const values = Array.from({ length: 1001 }, () => random.uniform())
    const before = [...values]
    // source: the rank-⌊q(n − 1)⌋ element of the sorted list (definition; Array.prototype.sort as reference)
    const sorted = [...values].sort((a, b) => a - b)
    expect(selectQuantile(values, 0.5)).toBe(sorted[500])
    expect(selectQuantile(values, 0.25)).toBe(sorted[250])
    expect(selectQuantile(values, 0)).toBe(sorted[0])
    expect(selectQuantile(values, 1)).toBe(sorted[1000])
    expect(values).toEqual(before)
  })

  it('handles ties, clamps q and uses a scratch buffer', () => {
    const values = [3, 1, 3, 3, 2, 3, 1]
    const scratch = new Float64Array(10)
    expect(selectQuantile(values, 0.5, scratch)).toBe(3) // source: sorted 1 1 2 3 3 3 3, rank 3 → 3
    expect(selectQuantile(values, -1)).toBe(1)
    expect(selectQuantile(values, 2)).toBe(3)
    expect(Number.isNaN(selectQuantile([], 0.5))).toBe(true)
  })
})
