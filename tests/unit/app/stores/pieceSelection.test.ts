import { createPinia, setActivePinia } from 'pinia'
import { beforeEach, describe, expect, it } from 'vitest'
import { usePieceSelectionStore } from '../../../../app/stores/pieceSelection'

describe('usePieceSelectionStore', () => {
  beforeEach(() => setActivePinia(createPinia()))

  it('ticks and unticks one piece', () => {
    const selection = usePieceSelectionStore()
    selection.toggle('a')
    selection.toggle('b')
    selection.toggle('a')
    expect(selection.ids).toEqual(['b'])
    expect(selection.has('a')).toBe(false)
    expect(selection.count).toBe(1)
  })

  it('ticks a whole page without doubling pieces already ticked, and unticks only that page', () => {
    const selection = usePieceSelectionStore()
    selection.toggle('x')
    selection.setMany(['x', 'y', 'z'], true)
    expect(selection.ids).toEqual(['x', 'y', 'z'])
    selection.toggle('w')
    selection.setMany(['y', 'z'], false)
    expect(selection.ids).toEqual(['x', 'w'])
  })

  it('keeps the ticks until cleared', () => {
    const selection = usePieceSelectionStore()
    selection.setMany(['p', 'q'], true)
    selection.clear()
    expect(selection.count).toBe(0)
  })
})
