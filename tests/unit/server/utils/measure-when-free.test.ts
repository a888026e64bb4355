import { describe, expect, it } from 'vitest'
import { measureWhenFree } from '../../../../server/utils/measure-when-free'

// The analysis pool's refusal of a full queue, as throwPoolError makes it (503, Retry-After in data).
const busy = (retryAfterS = 5) => Object.assign(new Error('busy'), { statusCode: 503, data: { retryAfterS } })

function fakeClock() {
  let t = 0
  const waits: number[] = []
  const wait = async (ms: number) => {
    waits.push(ms)
    t += ms
  }
  return { waits, now: () => t, wait }
}

describe('measureWhenFree', () => {
  it('waits the time the pool asks while it is busy, then answers the measurement', async () => {
    const clock = fakeClock()
    let calls = 0
    const result = await measureWhenFree(async () => {
      if (++calls < 3) throw busy(5)
      return 'measured'
    }, clock)
    expect(result).toBe('measured')
    expect(clock.waits).toEqual([5000, 5000])
  })

  it('throws any other failure at once (an engine refusal is the strike\'s own answer)', async () => {
    const clock = fakeClock()
    const refusal = Object.assign(new Error('The recording is silent.'), { statusCode: 422 })
    const refuse = async () => {
      throw refusal
    }
    await expect(measureWhenFree(refuse, clock)).rejects.toBe(refusal)
    expect(clock.waits).toEqual([])
  })

  it('gives up with the pool\'s refusal once waiting would pass the limit', async () => {
    const clock = fakeClock()
    let calls = 0
    await expect(measureWhenFree(async () => {
      calls++
      throw busy(5)
    }, { ...clock, giveUpAfterMs: 12_000 })).rejects.toMatchObject({ statusCode: 503 })
    expect(calls).toBe(3)
    expect(clock.waits).toEqual([5000, 5000])
  })
})
