import { describe, expect, it } from 'vitest'
import { GUIDANCE_MARK, GUIDANCE_WORDS, guidanceWords } from '../../../../shared/bench/guidanceWords'
import { thinningAdvice } from '../../../../shared/bench/thinningAdvice'

const m = (label: string, cents: number | null, toleranceCents = 3) => ({ label, cents, toleranceCents, within: cents !== null && Math.abs(cents) <= toleranceCents, missing: cents === null, required: true })
const wordsFor = (cents: number[], family: string) => thinningAdvice(cents.map((c, i) => m(`partial ${i + 1}`, c)), family).map(guidanceWords)

describe('guidance words', () => {
  it('a sharp bar fundamental: remove material at the centre', () => {
    // common practice: thinning the middle of a bar (the arch) lowers its fundamental
    expect(wordsFor([12], 'bar')).toEqual(['remove material: centre'])
  })

  it('a flat bar fundamental: remove material at the ends', () => {
    // common practice: shortening or thinning the ends of a bar raises its pitch
    expect(wordsFor([-8], 'bar')).toEqual(['remove material: ends'])
  })

  it('a sharp second partial of a bar: remove material about 28 % in from each end, not at the centre', () => {
    // source: Rayleigh-quotient perturbation of the free–free beam's second bending mode,
    // whose curvature peaks at about 0.28 L from each end and vanishes at the centre (from memory: 0.28 L)
    expect(wordsFor([0, 9], 'bar')).toEqual(['remove material: 28 % in from each end'])
  })

  it('pieces that do not bend like a bar get only the direction, in words', () => {
    expect(wordsFor([15, -15], 'bell')).toEqual([GUIDANCE_WORDS.pitchDown, GUIDANCE_WORDS.pitchUp])
  })

  it('never uses the sharp/flat triangles or the verdict words', () => {
    const all = [GUIDANCE_MARK, ...wordsFor([12, -9, 7, -7], 'bar'), ...wordsFor([5, -5], 'chime')]
    for (const w of all) expect(w).not.toMatch(/[▲▼△▽]|sharp|flat/)
  })
})
