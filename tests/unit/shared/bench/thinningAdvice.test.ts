import { describe, expect, it } from 'vitest'
import { thinningAdvice } from '../../../../shared/bench/thinningAdvice'

const m = (label: string, cents: number | null, toleranceCents = 3) => ({ label, cents, toleranceCents, within: cents !== null && Math.abs(cents) <= toleranceCents, missing: cents === null, required: true })

describe('thinning advice', () => {
  it('says nothing for partials within tolerance or missing', () => {
    expect(thinningAdvice([m('fundamental', 1.2), m('second', null)], 'bar')).toEqual([])
  })

  it('a sharp fundamental of a bar is lowered by thinning near the centre', () => {
    const [a] = thinningAdvice([m('fundamental', 12.4)], 'bar')
    expect(a!.move).toBe('lower')
    expect(a!.moveCents).toBeCloseTo(12.4, 6)
    expect(a!.sentence).toBe('Lower the fundamental by 12.4 ¢: thin near the centre of the bar.')
    expect(a!.thinAt[0]!.to).toBe(0.5)
  })

  it('a flat fundamental is raised by thinning within the outer ~15 % at each end', () => {
    const [a] = thinningAdvice([m('fundamental', -8)], 'plate')
    expect(a!.move).toBe('raise')
    expect(a!.sentence).toMatch(/^Raise the fundamental by 8\.0 ¢: thin within the outer 15 % of the length at each end\.$/)
  })

  it('a sharp second partial is lowered most at about 0.28 L, not at the centre', () => {
    const [a] = thinningAdvice([m('fundamental', 0), m('second (double octave)', 9, 5)], 'bar')
    expect(a!.label).toBe('second (double octave)')
    expect(a!.mode).toBe(2)
    expect(a!.sentence).toMatch(/about 0\.28 of the length from each end .*thinning at the centre leaves it unchanged/)
  })

  it('gives direction but no place for families that do not bend like a bar', () => {
    const [a] = thinningAdvice([m('hum', -20, 10)], 'bell')
    expect(a!.mode).toBeNull()
    expect(a!.thinAt).toEqual([])
    expect(a!.sentence).toBe('Raise the hum by 20.0 ¢.')
  })
})
