import { describe, expect, it } from 'vitest'
import { CutPlanInputSchema } from '../../../../shared/schemas/cutPlan'
import { plainSentence } from '../../../../shared/validation'

const bar = {
  lengthMm: 380, widthMm: 55, profile: [{ xMm: 0, thicknessMm: 22 }, { xMm: 380, thicknessMm: 22 }],
  densityKgM3: 1000, youngsModulusGPa: 20, partials: [{ ratio: 1, cents: 10, toleranceCents: 3 }],
}
const sentence = (input: unknown) => {
  const result = CutPlanInputSchema.safeParse(input)
  return result.success ? null : plainSentence(result.error)
}

describe('CutPlanInputSchema', () => {
  it('takes the issue\'s JSON as it is, the optional limits included', () => {
    expect(sentence(bar)).toBeNull()
    expect(sentence({ ...bar, maxDepthMm: 1.5, minThicknessMm: 8 })).toBeNull()
  })

  it('names the field and the range in one sentence', () => {
    expect(sentence({ ...bar, widthMm: 0 })).toBe('widthMm: The width must be between 2 and 500 mm.')
    expect(sentence({ ...bar, partials: [{ ratio: 1, cents: 2000, toleranceCents: 3 }] })).toBe('partials.0.cents: The deviation must be between -1200 and 1200 ¢.')
  })

  it('refuses a profile that does not start at 0 or runs backwards, and two partials of one ratio', () => {
    expect(sentence({ ...bar, profile: [{ xMm: 5, thicknessMm: 22 }, { xMm: 380, thicknessMm: 22 }] })).toMatch(/start at 0 mm/)
    expect(sentence({ ...bar, profile: [{ xMm: 0, thicknessMm: 22 }, { xMm: 380, thicknessMm: 22 }, { xMm: 380, thicknessMm: 22 }] })).toMatch(/left to right/)
    expect(sentence({ ...bar, partials: [bar.partials[0], bar.partials[0]] })).toMatch(/same ratio/)
  })
})
