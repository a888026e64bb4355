import { describe, expect, it } from 'vitest'
import { unchangedRun } from '../../../../shared/uncertainty/unchangedRun'

const cents = (hz: number, c: number) => hz * 2 ** (c / 1200)

describe('unchangedRun', () => {
  it('counts the newest strikes that read within the agreement of the newest', () => {
    // source: cents = 1200·log2(f/f_ref) (common practice); 0.6, 0.9 and 0.3 ¢ strikes of one bar agree, a 10 ¢ one came before a cut.
    expect(unchangedRun([cents(1046.5, 0.6), cents(1046.5, 0.9), cents(1046.5, 0.3), cents(1046.5, 10)])).toBe(3)
  })

  it('stops at a strike just past the agreement, and at one without a fundamental', () => {
    expect(unchangedRun([440, cents(440, 1.49), cents(440, -1.51)])).toBe(2)
    expect(unchangedRun([440, null, 440])).toBe(1)
  })

  it('counts the newest strike alone when it has no fundamental, and nothing when there are no strikes', () => {
    expect(unchangedRun([null, 440])).toBe(1)
    expect(unchangedRun([])).toBe(0)
  })
})
