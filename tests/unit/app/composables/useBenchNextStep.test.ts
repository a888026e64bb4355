import { describe, expect, it } from 'vitest'
import { allowedMoves, COMPOSITE_MOVES, stagePath, type PieceStage } from '../../../../shared/records/stages'
import { canSendToReview, nextPieceAfter } from '../../../../app/composables/useBenchNextStep'

const piece = (id: string, position: number, stage: PieceStage) => ({ id, position, stage })

describe('nextPieceAfter', () => {
  const pieces = [
    piece('a', 1, 'approved'), piece('b', 2, 'tuning'), piece('c', 3, 'review'),
    piece('d', 4, 'blank'), piece('e', 5, 'scrapped'), piece('f', 6, 'rework'),
  ]

  it('takes the next strikeable position, skipping pieces in review and the finished ones', () => {
    expect(nextPieceAfter(pieces, 'b')?.id).toBe('d')
    expect(nextPieceAfter(pieces, 'd')?.id).toBe('f')
    expect(nextPieceAfter(pieces, 'a')?.id).toBe('b')
  })

  it('wraps round to the first other strikeable piece after the last one', () => {
    expect(nextPieceAfter(pieces, 'f')?.id).toBe('b')
  })

  it('starts from the beginning for a piece not in the list, and finds none in a finished set', () => {
    expect(nextPieceAfter(pieces, null)?.id).toBe('b')
    expect(nextPieceAfter([piece('a', 1, 'approved'), piece('b', 2, 'tuning')], 'b')).toBeNull()
    expect(nextPieceAfter([], 'a')).toBeNull()
  })
})

describe('sending to review from the Bench', () => {
  it('needs a strike, a stage before review and a role that may make the move', () => {
    for (const stage of ['blank', 'roughed', 'tuning', 'rework']) expect(canSendToReview({ strikeCount: 1, stage }, 'benchmaker')).toBe(true)
    for (const stage of ['review', 'approved', 'certified', 'shipped', 'scrapped']) expect(canSendToReview({ strikeCount: 3, stage }, 'benchmaker')).toBe(false)
    expect(canSendToReview({ strikeCount: 0, stage: 'tuning' }, 'benchmaker')).toBe(false)
    expect(canSendToReview({ strikeCount: 1, stage: 'tuning' }, 'office')).toBe(false)
    expect(canSendToReview(null, 'owner')).toBe(false)
  })

  it('takes only moves the stage table allows, through tuning, ending in review', () => {
    for (const from of ['blank', 'roughed', 'tuning', 'rework'] as const) {
      const path = stagePath('benchmaker', from, 'review', COMPOSITE_MOVES.review)
      expect(path.steps?.at(-1)).toBe('review')
      let at: PieceStage = from
      for (const to of path.steps ?? []) {
        expect(allowedMoves(at)).toContain(to)
        at = to
      }
    }
    expect(stagePath('benchmaker', 'rework', 'review', COMPOSITE_MOVES.review).steps).toEqual(['tuning', 'review'])
    expect(stagePath('benchmaker', 'tuning', 'review', COMPOSITE_MOVES.review).steps).toEqual(['review'])
  })
})
