import { describe, expect, it } from 'vitest'
import { queryWriter } from '../../../../app/utils/queryWriter'

interface Filters { a: string, b: string }
const route: Filters = { a: 'x', b: 'y' }
const toQuery = (f: Filters) => Object.fromEntries(Object.entries(f).filter(([, v]) => v !== ''))

describe('queryWriter', () => {
  it('builds a change made before the last one reached the route on that last one', async () => {
    // The route still shows `route` while both writes are on their way (a router that has not resolved yet).
    const written: Record<string, string>[] = []
    const releases: (() => void)[] = []
    const update = queryWriter<Filters>({
      read: () => route,
      toQuery,
      write: (query) => {
        written.push(query)
        return new Promise<void>(resolve => releases.push(resolve))
      },
    })
    const first = update({ a: '' })
    const second = update({ b: '' })
    // Built on the route alone, the second would put a=x back.
    expect(written).toEqual([{ b: 'y' }, {}])
    releases.forEach(release => release())
    await Promise.all([first, second])
  })

  it('reads the route again once its writes have landed', async () => {
    let current = route
    const written: Record<string, string>[] = []
    const update = queryWriter<Filters>({ read: () => current, toQuery, write: async query => written.push(query) })
    await update({ a: 'z' })
    // Someone went back in the browser's history meanwhile: the route is read, not the last write.
    current = { a: 'w', b: 'y' }
    await update({ b: 'v' })
    expect(written).toEqual([{ a: 'z', b: 'y' }, { a: 'w', b: 'v' }])
  })

  it('clears its pending change when the write fails, so a refused navigation is not built on', async () => {
    const written: Record<string, string>[] = []
    let fail = true
    const update = queryWriter<Filters>({
      read: () => route,
      toQuery,
      write: async (query) => {
        written.push(query)
        if (fail) throw new Error('navigation aborted')
      },
    })
    await update({ a: 'q' })
    fail = false
    await update({ b: 'r' })
    expect(written.at(-1)).toEqual({ a: 'x', b: 'r' })
  })

  it('applies its adjustment to each change', async () => {
    const written: Record<string, string>[] = []
    const update = queryWriter<Filters>({
      read: () => route,
      toQuery,
      write: async query => written.push(query),
      adjust: (next, patch) => ('a' in patch ? next : { ...next, a: '' }),
    })
    await update({ a: 'n' })
    await update({ b: 'm' })
    expect(written).toEqual([{ a: 'n', b: 'y' }, { b: 'm' }])
  })
})
