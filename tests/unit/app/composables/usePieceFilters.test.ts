import { describe, expect, it } from 'vitest'
import { filterWriter, pieceFilterQuery, type PieceFilters } from '../../../../app/composables/usePieceFilters'

const base: PieceFilters = { set: 's1', stage: 'approved', verdict: 'outside', assignee: '', q: '', sort: 'position', page: 3 }

describe('pieceFilterQuery', () => {
  it('leaves out empty filters and defaults', () => {
    expect(pieceFilterQuery({ ...base, sort: 'position', page: 1, stage: '' })).toEqual({ set: 's1', verdict: 'outside' })
    expect(pieceFilterQuery({ ...base, sort: 'cents' })).toEqual({ set: 's1', stage: 'approved', verdict: 'outside', sort: 'cents', page: '3' })
  })
})

describe('filterWriter', () => {
  it('builds a change made before the last one reached the route on that last one', async () => {
    // The route still shows `base` while both writes are on their way (a router that has not resolved yet).
    const written: Record<string, string>[] = []
    const releases: (() => void)[] = []
    const update = filterWriter(() => base, (query) => {
      written.push(query)
      return new Promise<void>(resolve => releases.push(resolve))
    })
    const first = update({ stage: '' })
    const second = update({ verdict: '' })
    // Built on the route alone, the second would put stage=approved back.
    expect(written).toEqual([{ set: 's1', verdict: 'outside' }, { set: 's1' }])
    releases.forEach(release => release())
    await Promise.all([first, second])
  })

  it('reads the route again once its writes have landed, and goes back to page 1 unless the page is the change', async () => {
    let route = base
    const written: Record<string, string>[] = []
    const update = filterWriter(() => route, async (query) => {
      written.push(query)
    })
    await update({ page: 4 })
    expect(written.at(-1)).toEqual({ set: 's1', stage: 'approved', verdict: 'outside', page: '4' })
    // Someone went back in the browser's history meanwhile: the route is read, not the last write.
    route = { ...base, stage: 'tuning' }
    await update({ q: 'G6' })
    expect(written.at(-1)).toEqual({ set: 's1', stage: 'tuning', verdict: 'outside', q: 'G6' })
  })

  it('clears its pending change when the write fails, so a refused navigation is not built on', async () => {
    const written: Record<string, string>[] = []
    let fail = true
    const update = filterWriter(() => base, async (query) => {
      written.push(query)
      if (fail) throw new Error('navigation aborted')
    })
    await update({ stage: 'rework' })
    fail = false
    await update({ q: 'x' })
    expect(written.at(-1)).toEqual({ set: 's1', stage: 'approved', verdict: 'outside', q: 'x' })
  })
})
