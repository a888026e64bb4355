import { afterEach, describe, expect, it, vi } from 'vitest'
import { withMinimumDuration } from '../../../../server/utils/timing'

describe('withMinimumDuration', () => {
  afterEach(() => vi.useRealTimers())

  it('holds a quick answer back until the minimum has passed', async () => {
    vi.useFakeTimers()
    let settled = false
    const answer = withMinimumDuration(300, async () => 'same answer').then((value) => {
      settled = true
      return value
    })
    await vi.advanceTimersByTimeAsync(299)
    expect(settled).toBe(false)
    await vi.advanceTimersByTimeAsync(1)
    expect(await answer).toBe('same answer')
  })

  it('holds a failure back too, so an error does not answer sooner', async () => {
    vi.useFakeTimers()
    let settled = false
    const answer = withMinimumDuration(200, async () => {
      throw new Error('unknown record')
    }).catch((error: Error) => {
      settled = true
      return error.message
    })
    await vi.advanceTimersByTimeAsync(150)
    expect(settled).toBe(false)
    await vi.advanceTimersByTimeAsync(50)
    expect(await answer).toBe('unknown record')
  })
})
