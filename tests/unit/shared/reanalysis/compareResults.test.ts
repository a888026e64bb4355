import { describe, expect, it } from 'vitest'
import { CENTS_CHANGE_THRESHOLD, compareResults, summarise, type ResultSummary } from '../../../../shared/reanalysis/compareResults'
import { changeCounts, changeSummary, changeTable } from '../../../../shared/reanalysis/changeTable'
import type { ReanalysisResult } from '../../../../shared/reanalysis/types'

const m = (label: string, ratio: number, cents: number | null, tol = 3) =>
  ({ label, ratio, cents, within: cents !== null && Math.abs(cents) <= tol, missing: cents === null })

const before: ResultSummary = { engineVersion: '1.0.0', verdict: 'within', worstCents: -2.5, matches: [m('fundamental', 1, 1.2), m('second', 4, -2.5)] }

describe('compareResults', () => {
  it('reports each partial\'s cents change as new − old, and the verdict move', () => {
    const after: ResultSummary = { engineVersion: '2.0.0', verdict: 'outside', worstCents: -3.4, matches: [m('second', 4, -3.4), m('fundamental', 1, 1.2)] }
    const c = compareResults(before, after)
    expect(c.verdictChanged).toBe(true)
    expect(c.oldEngineVersion).toBe('1.0.0')
    expect(c.newEngineVersion).toBe('2.0.0')
    expect(c.partials.map(p => p.label)).toEqual(['fundamental', 'second'])
    expect(c.partials[1]!.changeCents).toBeCloseTo(-0.9, 12)
    expect(c.partials[1]!.changed).toBe(true)
    expect(c.partials[0]!.changeCents).toBe(0)
    expect(c.partials[0]!.changed).toBe(false)
    expect(c.largestChangeCents).toBeCloseTo(0.9, 12)
    expect(c.changed).toBe(true)
  })

  it('counts a move below what the screens print (0.1 ¢) as unchanged', () => {
    const small = CENTS_CHANGE_THRESHOLD * 0.8
    const after: ResultSummary = { ...before, engineVersion: '2.0.0', matches: [m('fundamental', 1, 1.2 + small), m('second', 4, -2.5 - small)] }
    const c = compareResults(before, after)
    expect(c.changed).toBe(false)
    expect(c.largestChangeCents).toBeCloseTo(small, 12)
  })

  it('marks a partial found or lost as changed, with no cents change', () => {
    const after: ResultSummary = { engineVersion: '2.0.0', verdict: 'incomplete', worstCents: 1.2, matches: [m('fundamental', 1, 1.2), m('second', 4, null)] }
    const c = compareResults(before, after)
    expect(c.partials[1]).toMatchObject({ oldCents: -2.5, newCents: null, changeCents: null, changed: true })
    expect(c.verdictChanged).toBe(true)
  })

  it('reads stored results defensively', () => {
    expect(summarise('1.0.0', 'bogus', null, null)).toEqual({ engineVersion: '1.0.0', verdict: null, worstCents: null, matches: [] })
    const s = summarise('1.0.0', 'within', 0.5, { matches: [{ label: 'fundamental', ratio: 1, cents: 0.5, within: true, missing: false }, null, 'x'] })
    expect(s.matches).toEqual([{ label: 'fundamental', ratio: 1, cents: 0.5, within: true, missing: false }])
  })
})

describe('change table', () => {
  const after: ResultSummary = { engineVersion: '2.0.0', verdict: 'outside', worstCents: -3.4, matches: [m('fundamental', 1, 1.2), m('second', 4, -3.4)] }
  const result: ReanalysisResult = {
    engineVersion: '2.0.0', strikeCount: 3, pieceCount: 2, done: true,
    pieces: [
      { pieceId: 'a', position: 1, note: 'C5', stage: 'tuning', signed: false, oldVerdict: 'within', newVerdict: 'outside', oldWorstCents: -2.5, newWorstCents: -3.4, changed: true,
        strikes: [
          { strikeId: 's1', recordedAt: '2026-03-14T09:30:00.000Z', applied: true, error: null, change: compareResults(before, after) },
          { strikeId: 's2', recordedAt: '2026-03-14T09:31:00.000Z', applied: false, error: 'The recording of this strike is missing from storage.', change: null },
        ] },
      { pieceId: 'b', position: 2, note: 'D5', stage: 'certified', signed: true, oldVerdict: 'within', newVerdict: 'within', oldWorstCents: -2.5, newWorstCents: -2.5, changed: false,
        strikes: [{ strikeId: 's3', recordedAt: '2026-03-14T09:32:00.000Z', applied: false, error: null, change: compareResults(before, { ...before, engineVersion: '2.0.0' }) }] },
    ],
  }

  it('counts and summarises what moved, naming the signed pieces kept in history', () => {
    expect(changeCounts(result)).toEqual({ pieces: 2, strikes: 3, measured: 2, changed: 1, verdictChanged: 1, keptOnSigned: 1, failed: 1 })
    expect(changeSummary(result)).toBe('Re-measured 2 strikes of 2 pieces with engine 2.0.0: 1 changed, 1 verdict changed, 1 on signed pieces kept in the history only (their signed results and stages stay), 1 could not be measured.')
  })

  it('prints one row per changed or failed strike, old → new', () => {
    const lines = changeTable(result).split('\n')
    expect(lines).toHaveLength(4)
    expect(lines[2]).toContain('1 C5')
    expect(lines[2]).toContain('1.0.0 → 2.0.0')
    expect(lines[2]).toContain('within → outside')
    expect(lines[2]).toContain('−2.5 ¢ → −3.4 ¢')
    expect(lines[2]).toContain('0.9 ¢')
    expect(lines[3]).toContain('missing from storage')
    expect(changeTable({ ...result, pieces: [result.pieces[1]!] })).toBe('Nothing changed.')
  })
})
