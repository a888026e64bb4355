import { describe, expect, it } from 'vitest'
import { useProblem } from '../../../../app/composables/useProblem'

describe('useProblem', () => {
  it('shows the server’s sentence when the request fails, and clears it on the next try', async () => {
    const { problem, attempt } = useProblem()
    expect(await attempt(async () => {
      throw Object.assign(new Error('422'), { statusCode: 422, data: { message: 'That set has no pieces yet.' } })
    })).toBeUndefined()
    expect(problem.value).toBe('That set has no pieces yet.')
    expect(await attempt(async () => 7)).toBe(7)
    expect(problem.value).toBeNull()
  })

  it('says plainly when the server could not be reached', async () => {
    const { problem, attempt } = useProblem()
    await attempt(async () => {
      throw new TypeError('fetch failed')
    })
    expect(problem.value).toBe('The server could not be reached. Check the connection and try again.')
  })

  it('is busy only while the request runs, also when it fails', async () => {
    const { busy, attempt } = useProblem()
    let seen: boolean | undefined
    await attempt(async () => {
      seen = busy.value
      throw new Error('boom')
    })
    expect(seen).toBe(true)
    expect(busy.value).toBe(false)
  })
})
