import { describe, expect, it } from 'vitest'
import { benchKeyAction } from '../../../../app/composables/useBenchKeys'

const key = (k: string, mods: Partial<{ ctrlKey: boolean, metaKey: boolean, altKey: boolean }> = {}) =>
  ({ key: k, ctrlKey: false, metaKey: false, altKey: false, ...mods })
const on = (tagName: string, isContentEditable = false) => ({ tagName, isContentEditable })

describe('benchKeyAction', () => {
  it('maps space, n and r to strike, next piece and review', () => {
    expect(benchKeyAction(key(' '), on('BODY'))).toBe('strike')
    expect(benchKeyAction(key(' '), null)).toBe('strike')
    expect(benchKeyAction(key('n'), on('BODY'))).toBe('next')
    expect(benchKeyAction(key('r'), on('DIV'))).toBe('review')
    expect(benchKeyAction(key('x'), on('BODY'))).toBeNull()
  })

  it('leaves key combinations to the browser', () => {
    expect(benchKeyAction(key('r', { ctrlKey: true }), on('BODY'))).toBeNull()
    expect(benchKeyAction(key('r', { metaKey: true }), on('BODY'))).toBeNull()
    expect(benchKeyAction(key('n', { altKey: true }), on('BODY'))).toBeNull()
  })

  it('does nothing while typing in a field', () => {
    for (const tag of ['INPUT', 'TEXTAREA', 'SELECT']) {
      expect(benchKeyAction(key('r'), on(tag))).toBeNull()
      expect(benchKeyAction(key(' '), on(tag))).toBeNull()
    }
    expect(benchKeyAction(key('n'), on('DIV', true))).toBeNull()
  })

  // common practice: space activates a focused button, link or disclosure, so it must not also strike
  it('lets a focused button, link or summary keep its own space bar', () => {
    for (const tag of ['BUTTON', 'A', 'SUMMARY']) expect(benchKeyAction(key(' '), on(tag))).toBeNull()
    expect(benchKeyAction(key('n'), on('BUTTON'))).toBe('next')
  })
})
