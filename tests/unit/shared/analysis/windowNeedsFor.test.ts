import { describe, expect, it } from 'vitest'
import { windowNeedsFor } from '../../../../shared/analysis/windowNeedsFor'
import { synthStrike } from '../../../support/synthStrike'

const sampleRate = 48000
// A bar tuned 1 : 4 (common practice for marimba bars) at A3.
const x = synthStrike([
  { frequencyHz: 220, amplitudeDb: -6, decayDbPerS: 10 },
  { frequencyHz: 880, amplitudeDb: -20, decayDbPerS: 30 },
], { sampleRate, durationS: 1, noiseDb: -90, seed: 7 })
const span = { startIndex: 0, endIndex: x.length }

describe('windowNeedsFor', () => {
  it('takes spacing and lowest partial from a rough look without a template', () => {
    const needs = windowNeedsFor(x, sampleRate, span, null, false)
    expect(needs.windowFrom).toBe('rough-pass')
    expect(Math.abs(needs.lowestHz - 220)).toBeLessThan(2)
    expect(Math.abs(needs.spacingHz - 660)).toBeLessThan(3)
    expect(needs.neighbourLists[1]).toEqual([])
  })

  it('adds the template\'s expected partials, which can only add needs', () => {
    // A template expecting a partial at ×3.9 too: 660 Hz − 22 Hz apart from the ×4.
    const needs = windowNeedsFor(x, sampleRate, span, [220, 858, 880, 880, 30000], false)
    expect(needs.windowFrom).toBe('template')
    expect(needs.neighbourLists[1]).toEqual([220, 858, 880]) // duplicates and frequencies over Nyquist left out
    expect(needs.spacingHz).toBeCloseTo(22, 9)
    const lower = windowNeedsFor(x, sampleRate, span, [110, 880], false)
    expect(lower.lowestHz).toBe(110)
  })

  it('says where the window came from', () => {
    expect(windowNeedsFor(x, sampleRate, span, [220], true).windowFrom).toBe('option')
    const silence = new Float64Array(48000)
    expect(windowNeedsFor(silence, sampleRate, { startIndex: 0, endIndex: 48000 }, null, false)).toMatchObject({ windowFrom: 'default', lowestHz: 100, spacingHz: Infinity })
  })
})
