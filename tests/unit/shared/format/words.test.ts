import { describe, expect, it } from 'vitest'
import { capitalised, wordsOr } from '../../../../shared/format/words'
import { ROLES } from '../../../../shared/auth/roles'

describe('words', () => {
  it('names a list in a sentence the way the messages always did', () => {
    // common practice: "a, b or c" without a serial comma, as the form messages are written.
    expect(`Choose a role: ${wordsOr(ROLES)}`).toBe('Choose a role: owner, supervisor, benchmaker or office')
    expect(wordsOr(['a4', 'letter'])).toBe('a4 or letter')
    expect(wordsOr(['one'])).toBe('one')
    expect(wordsOr([])).toBe('')
  })

  it('capitalises a label', () => {
    expect(capitalised('superseded')).toBe('Superseded')
    expect(capitalised('')).toBe('')
  })
})
