import { describe, expect, it } from 'vitest'
import { expectedPartials } from '../../../../shared/analysis/expectedPartials'

describe('expectedPartials', () => {
  it('has no target, template or expected partials without a target', () => {
    expect(expectedPartials({ ratios: [1, 4, 10] })).toEqual({ target: null, template: null, expectedHz: null })
  })

  it('puts each template partial at ratio × the target fundamental', () => {
    const { target, template, expectedHz } = expectedPartials({ note: 'C4', ratios: [1, 4, 10] })
    // source: equal temperament with A4 = 440 Hz, C4 = 440 · 2^(−9/12) = 261.6256 Hz (common practice)
    expect(target!.fundamentalHz).toBeCloseTo(261.6256, 4)
    expect(template!.partials.map(p => p.ratio)).toEqual([1, 4, 10])
    expect(expectedHz!.map(f => f / target!.fundamentalHz)).toEqual([1, 4, 10].map(r => expect.closeTo(r, 12)))
  })
})
