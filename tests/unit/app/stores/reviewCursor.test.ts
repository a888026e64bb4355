import { createPinia, setActivePinia } from 'pinia'
import { beforeEach, describe, expect, it } from 'vitest'
import { useReviewCursorStore } from '../../../../app/stores/reviewCursor'

describe('useReviewCursorStore', () => {
  beforeEach(() => setActivePinia(createPinia()))

  it('opens the first piece of a fresh queue and moves within its ends', () => {
    const cursor = useReviewCursorStore()
    cursor.load(['a', 'b', 'c'])
    expect(cursor.currentId).toBe('a')
    cursor.move(1)
    cursor.move(5)
    expect(cursor.currentId).toBe('c')
    cursor.move(-9)
    expect(cursor.currentId).toBe('a')
  })

  it('keeps the open piece when a refresh reorders the queue', () => {
    const cursor = useReviewCursorStore()
    cursor.load(['a', 'b', 'c'])
    cursor.select('b')
    cursor.load(['c', 'b', 'a'])
    expect(cursor.currentId).toBe('b')
    expect(cursor.index).toBe(1)
  })

  it('opens the piece now at the same place when the open one left the queue', () => {
    const cursor = useReviewCursorStore()
    cursor.load(['a', 'b', 'c'])
    cursor.select('b')
    cursor.load(['a', 'c'])
    expect(cursor.currentId).toBe('c')
    cursor.load(['a'])
    expect(cursor.currentId).toBe('a')
    cursor.load([])
    expect(cursor.currentId).toBeNull()
    cursor.move(1)
    expect(cursor.currentId).toBeNull()
  })

  it('ignores a piece that is not in the queue', () => {
    const cursor = useReviewCursorStore()
    cursor.load(['a', 'b'])
    cursor.select('zz')
    expect(cursor.currentId).toBe('a')
  })
})
