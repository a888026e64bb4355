import { describe, expect, it } from 'vitest'
import { reviewFilterQuery } from '../../../../app/composables/useReviewQueue'

describe('reviewFilterQuery', () => {
  it('leaves out empty filters', () => {
    expect(reviewFilterQuery({ set: 's1', benchmaker: '', group: 'set' })).toEqual({ set: 's1', group: 'set' })
    expect(reviewFilterQuery({ set: '', benchmaker: '', group: '' })).toEqual({})
  })
})
