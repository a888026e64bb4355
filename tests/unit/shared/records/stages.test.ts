import { describe, expect, it } from 'vitest'
import {
  allowedMoves, arrivalProblem, DECISION_MOVES, assigneeAfter, assigneeProblem, AT_BENCH_STAGES, FINISHED_STAGES, isCompositeMove, isFinished,
  isPieceStage, isStrikeable, MOVE_TARGETS, stageAfterStrike, stageMoveProblem, stageMoveRoleProblem, stagePath, STRIKEABLE_STAGES,
} from '../../../../shared/records/stages'

// The stage order and side exits written in README.md (Roles and stages):
// blank → roughed → tuning → review → approved → certified → shipped; rework back to tuning; scrapped.
describe('piece stages', () => {
  it('follows the workflow forward and lets rework go back to tuning', () => {
    expect(stageMoveProblem('benchmaker', 'blank', 'roughed')).toBeNull()
    expect(stageMoveProblem('benchmaker', 'roughed', 'tuning')).toBeNull()
    expect(stageMoveProblem('benchmaker', 'tuning', 'review')).toBeNull()
    expect(stageMoveProblem('benchmaker', 'rework', 'tuning')).toBeNull()
  })

  it('keeps approval, certification and shipping to their own actions', () => {
    expect(stageMoveProblem('supervisor', 'review', 'approved')).toMatch(/Review screen/)
    expect(stageMoveProblem('owner', 'approved', 'tuning')).toMatch(/reopened/)
    expect(allowedMoves('approved')).toEqual([])
    expect(allowedMoves('certified')).toEqual([])
    expect(allowedMoves('shipped')).toEqual([])
  })

  it('leaves scrapping to a supervisor or owner, and stage changes out of the office', () => {
    expect(stageMoveProblem('benchmaker', 'tuning', 'scrapped')).toMatch(/supervisor/)
    expect(stageMoveProblem('supervisor', 'tuning', 'scrapped')).toBeNull()
    expect(stageMoveProblem('office', 'blank', 'roughed')).toMatch(/office/)
    // The role's own refusals, which the server answers with 403 rather than 409.
    expect(stageMoveRoleProblem('office', 'roughed')).toMatch(/office/)
    expect(stageMoveRoleProblem('benchmaker', 'scrapped')).toMatch(/supervisor/)
    expect(stageMoveRoleProblem('benchmaker', 'review')).toBeNull()
    expect(stageMoveRoleProblem('supervisor', 'scrapped')).toBeNull()
  })

  it('refuses a move to the same stage and unknown jumps', () => {
    expect(stageMoveProblem('owner', 'tuning', 'tuning')).toMatch(/already/)
    expect(stageMoveProblem('owner', 'blank', 'review')).toMatch(/cannot go/)
  })

  it('takes strikes only before approval', () => {
    expect(STRIKEABLE_STAGES).not.toContain('approved')
    expect(STRIKEABLE_STAGES).not.toContain('scrapped')
    expect(STRIKEABLE_STAGES).toContain('rework')
  })

  it('narrows strings to stages and refuses the rest', () => {
    expect(isPieceStage('tuning')).toBe(true)
    expect(isPieceStage('Tuning')).toBe(false)
    expect(isPieceStage(null)).toBe(false)
    expect(isStrikeable('review')).toBe(true)
    expect(isStrikeable('approved')).toBe(false)
    expect(isStrikeable('polished')).toBe(false)
  })

  it('counts a piece as finished from approval on', () => {
    // A set is certified when every piece is approved (shared/product.md); certified and shipped are later still.
    expect([...FINISHED_STAGES]).toEqual(['approved', 'certified', 'shipped'])
    expect(isFinished('approved')).toBe(true)
    expect(isFinished('review')).toBe(false)
    expect(isFinished('scrapped')).toBe(false)
  })

  it('keeps the bench list to pieces still being worked on', () => {
    expect([...AT_BENCH_STAGES]).toEqual(['blank', 'roughed', 'tuning', 'rework'])
  })

  it('offers as plain-change targets only the stages some plain move reaches', () => {
    expect([...MOVE_TARGETS]).toEqual(['blank', 'roughed', 'tuning', 'review', 'scrapped'])
    for (const s of ['approved', 'certified', 'shipped', 'rework']) expect(MOVE_TARGETS).not.toContain(s)
  })

  it('puts a struck blank or returned piece into tuning and leaves roughing and review alone', () => {
    expect(stageAfterStrike('blank')).toBe('tuning')
    expect(stageAfterStrike('rework')).toBe('tuning')
    expect(stageAfterStrike('roughed')).toBe('roughed')
    expect(stageAfterStrike('review')).toBe('review')
  })

  it('needs a strike before review', () => {
    expect(arrivalProblem('review', 0)).toMatch(/no strike/)
    expect(arrivalProblem('review', 1)).toBeNull()
    expect(arrivalProblem('tuning', 0)).toBeNull()
  })

  it('keeps a benchmaker to unassigned pieces and their own, and lets them take an unassigned one', () => {
    expect(assigneeProblem('benchmaker', 'u1', 'u2')).toMatch(/someone else/)
    expect(assigneeProblem('benchmaker', 'u1', 'u1')).toBeNull()
    expect(assigneeProblem('benchmaker', 'u1', null)).toBeNull()
    expect(assigneeProblem('supervisor', 'u1', 'u2')).toBeNull()
    expect(assigneeAfter('benchmaker', 'u1', null)).toBe('u1')
    expect(assigneeAfter('benchmaker', 'u1', 'u2')).toBe('u2')
    expect(assigneeAfter('owner', 'u1', null)).toBeNull()
  })

  it('sends a piece to review through tuning in one path of plain moves', () => {
    expect(isCompositeMove('review', 'tuning')).toBe(true)
    expect(isCompositeMove('review', 'roughed')).toBe(false)
    expect(isCompositeMove('tuning', 'roughed')).toBe(false)
    expect(stagePath('benchmaker', 'roughed', 'review', 'tuning')).toEqual({ steps: ['tuning', 'review'], problem: null })
    expect(stagePath('benchmaker', 'blank', 'review', 'tuning')).toEqual({ steps: ['tuning', 'review'], problem: null })
    expect(stagePath('benchmaker', 'rework', 'review', 'tuning')).toEqual({ steps: ['tuning', 'review'], problem: null })
    // Already in the middle stage: the one remaining move.
    expect(stagePath('benchmaker', 'tuning', 'review', 'tuning')).toEqual({ steps: ['review'], problem: null })
    expect(stagePath('owner', 'tuning', 'scrapped')).toEqual({ steps: ['scrapped'], problem: null })
  })

  it('refuses a composite move whose first step is not allowed, and the office with 403', () => {
    expect(stagePath('benchmaker', 'review', 'review', 'tuning')).toMatchObject({ steps: null, status: 409, problem: expect.stringMatching(/already/) })
    expect(stagePath('supervisor', 'approved', 'review', 'tuning')).toMatchObject({ steps: null, status: 409, problem: expect.stringMatching(/reopened/) })
    expect(stagePath('owner', 'scrapped', 'review', 'tuning')).toMatchObject({ steps: null, status: 409 })
    expect(stagePath('office', 'roughed', 'review', 'tuning')).toMatchObject({ steps: null, status: 403, problem: expect.stringMatching(/office/) })
    expect(stagePath('benchmaker', 'tuning', 'scrapped')).toMatchObject({ steps: null, status: 403 })
    expect(stagePath('benchmaker', 'blank', 'review')).toMatchObject({ steps: null, status: 409, problem: expect.stringMatching(/cannot go/) })
  })

  it('gives each supervisor decision its own move, none of them a plain change', () => {
    // Product notes: review → approved; rework is returned by a supervisor and goes back to tuning.
    expect(DECISION_MOVES.approve).toEqual({ from: 'review', to: 'approved' })
    expect(DECISION_MOVES.return).toEqual({ from: 'review', to: 'rework' })
    expect(DECISION_MOVES.reopen).toEqual({ from: 'approved', to: 'tuning' })
    for (const { from, to } of Object.values(DECISION_MOVES)) expect(allowedMoves(from)).not.toContain(to)
  })
})
