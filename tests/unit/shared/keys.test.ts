import { describe, expect, it } from 'vitest'
import { KEY_ACTIONS, PAGE_KEYS, keyActionFor, type KeyAction } from '../../../shared/keys'

const press = (key: string, mods: Partial<{ ctrlKey: boolean, metaKey: boolean, altKey: boolean }> = {}) =>
  ({ key, ctrlKey: false, metaKey: false, altKey: false, ...mods })
const on = (tagName: string, isContentEditable = false) => ({ tagName, isContentEditable })

// source: issue 13 ("Keys are the same meaning everywhere (one key map in one place, shown by `?`)")
describe('the key map', () => {
  it('gives no key two meanings, on any page', () => {
    const meaningOf = new Map<string, KeyAction>()
    for (const [action, { keys }] of Object.entries(KEY_ACTIONS) as [KeyAction, { keys: readonly string[] }][]) {
      for (const key of keys) {
        expect(meaningOf.get(key), `${JSON.stringify(key)} means ${meaningOf.get(key)} and ${action}`).toBeUndefined()
        meaningOf.set(key, action)
      }
    }
    // The map has keys at all (a map emptied by mistake would pass the loop above).
    expect(meaningOf.size).toBeGreaterThanOrEqual(Object.keys(KEY_ACTIONS).length)
  })

  it('shows each key as it is written on the keyboard, one label per key', () => {
    for (const { keys, shown, meaning } of Object.values(KEY_ACTIONS)) {
      expect(shown).toHaveLength(keys.length)
      expect(meaning).toMatch(/^[A-Z].*[a-z)]$/)
    }
  })

  it('lists each page\'s actions once, `?` among them', () => {
    for (const actions of Object.values(PAGE_KEYS)) {
      expect(new Set(actions).size).toBe(actions.length)
      expect(actions).toContain('showKeys')
    }
  })

  it('sends to review with r on the Bench and returns for rework with x on Review; r does nothing on Review', () => {
    expect(keyActionFor('bench', press('r'), on('BODY'))).toBe('sendToReview')
    expect(keyActionFor('review', press('x'), on('BODY'))).toBe('returnForRework')
    expect(keyActionFor('review', press('r'), on('BODY'))).toBeNull()
    expect(keyActionFor('bench', press('x'), on('BODY'))).toBeNull()
    expect(keyActionFor('review', press('ArrowDown'), null)).toBe('queueNext')
    expect(keyActionFor('review', press('?'), on('BODY'))).toBe('showKeys')
    expect(keyActionFor('bench', press('?'), on('BODY'))).toBe('showKeys')
  })

  // common practice: Ctrl/Cmd/Alt combinations belong to the browser, and typed text is never a command
  it('leaves key combinations to the browser and text fields to typing, Escape excepted', () => {
    expect(keyActionFor('review', press('a', { ctrlKey: true }), on('BODY'))).toBeNull()
    expect(keyActionFor('review', press('a', { metaKey: true }), on('BODY'))).toBeNull()
    expect(keyActionFor('review', press('u', { altKey: true }), on('BODY'))).toBeNull()
    for (const tag of ['INPUT', 'TEXTAREA', 'SELECT']) {
      expect(keyActionFor('review', press('a'), on(tag))).toBeNull()
      expect(keyActionFor('review', press('?'), on(tag))).toBeNull()
      expect(keyActionFor('review', press('Escape'), on(tag))).toBe('leaveField')
    }
    expect(keyActionFor('bench', press(' '), on('DIV', true))).toBeNull()
  })
})
