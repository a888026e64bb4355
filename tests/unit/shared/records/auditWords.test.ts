import { describe, expect, it } from 'vitest'
import { auditSentence } from '../../../../shared/records/auditWords'

const facts = (action: string, more: Partial<Parameters<typeof auditSentence>[0]> = {}) =>
  ({ action, fromState: null, toState: null, details: null, ...more })

describe('auditSentence', () => {
  it('says what an edit of a set changed, before and after', () => {
    const e = facts('set.edit', { details: { changes: [{ field: 'buyer', from: 'A', to: 'B' }, { field: 'due date', from: null, to: '2026-12-01' }] } })
    expect(auditSentence(e)).toBe('changed buyer: A → B; due date: (none) → 2026-12-01')
  })

  it('names stages, certificates and counts', () => {
    expect(auditSentence(facts('piece.stage', { fromState: 'tuning', toState: 'review' }))).toBe('moved the piece from tuning to review')
    expect(auditSentence(facts('set.create', { details: { pieces: 1 } }))).toBe('entered the set with 1 piece')
    expect(auditSentence(facts('certificate.reissue', { details: { number: 'TW-2026-0001', supersededBy: 'TW-2026-0002', changes: [{ field: 'buyer', from: 'A', to: 'B' }] } })))
      .toBe('re-issued certificate TW-2026-0001 as TW-2026-0002 (changed: buyer: A → B)')
  })

  it('reads an action it has no sentence for as its words, with the move', () => {
    expect(auditSentence(facts('lot.link', { fromState: 'a', toState: 'b' }))).toBe('lot link (a → b)')
    expect(auditSentence(facts('set.edit', { details: { changes: 'not a list' } }))).toBe('changed nothing')
  })
})
