import { describe, expect, it } from 'vitest'
import { allowedMoves, stageMoveProblem, stageMoveRoleProblem, STRIKEABLE_STAGES } from '../../../../shared/records/stages'

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
})
