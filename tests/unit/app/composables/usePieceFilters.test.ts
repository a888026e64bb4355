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
  it('goes back to page 1 unless the page is the change', async () => {
    const written: Record<string, string>[] = []
    const update = filterWriter(() => base, async query => written.push(query))
    await update({ page: 4 })
    await update({ q: 'G6' })
    expect(written).toEqual([
      { set: 's1', stage: 'approved', verdict: 'outside', page: '4' },
      { set: 's1', stage: 'approved', verdict: 'outside', q: 'G6' },
    ])
  })

  it('clearing Stage then Latest verdict in quick succession clears both', async () => {
    const written: Record<string, string>[] = []
    const releases: (() => void)[] = []
    const update = filterWriter(() => base, (query) => {
      written.push(query)
      return new Promise<void>(resolve => releases.push(resolve))
    })
    const both = [update({ stage: '' }), update({ verdict: '' })]
    expect(written.at(-1)).toEqual({ set: 's1' })
    releases.forEach(release => release())
    await Promise.all(both)
  })
})
