import { getPriority } from 'node:os'
import { describe, expect, it } from 'vitest'
import { lowerThreadPriority } from '../../../../server/workers/lowerThreadPriority'

describe('lowerThreadPriority', () => {
  it('leaves the main thread alone', () => {
    const before = getPriority()
    expect(lowerThreadPriority()).toBe(false)
    expect(getPriority()).toBe(before)
  })
})
