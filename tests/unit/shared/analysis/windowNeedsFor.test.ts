import { describe, expect, it } from 'vitest'
import { DEFAULT_LOWEST_HZ, windowNeedsFor } from '../../../../shared/analysis/windowNeedsFor'
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

  it('takes an expected lowest partial just under the rough pass\'s lowest peak for that peak', () => {
    // A bar 4 % sharp of its target (220 Hz measured, 212 expected) or a drum read during its
    // glide: the target names the same partial, so the window stays the one the sound asks for.
    const none = windowNeedsFor(x, sampleRate, span, null, false)
    expect(windowNeedsFor(x, sampleRate, span, [212, 848], false).lowestHz).toBe(none.lowestHz)
    expect(windowNeedsFor(x, sampleRate, span, [229, 916], false).lowestHz).toBe(none.lowestHz)
    // Clearly lower (under 1.1 / 1.25 of it) it is a partial of its own to resolve.
    expect(windowNeedsFor(x, sampleRate, span, [190, 760], false).lowestHz).toBe(190)
  })

  it('keeps the default lowest partial when the rough pass sees nothing: a template only lowers it', () => {
    const silence = new Float64Array(48000)
    const all = { startIndex: 0, endIndex: 48000 }
    expect(windowNeedsFor(silence, sampleRate, all, [110], false).lowestHz).toBe(DEFAULT_LOWEST_HZ)
    expect(windowNeedsFor(silence, sampleRate, all, [1000, 2000], false).lowestHz).toBe(DEFAULT_LOWEST_HZ)
    expect(windowNeedsFor(silence, sampleRate, all, [60], false).lowestHz).toBe(60)
  })

  it('says where the window came from', () => {
    expect(windowNeedsFor(x, sampleRate, span, [220], true).windowFrom).toBe('option')
    const silence = new Float64Array(48000)
    expect(windowNeedsFor(silence, sampleRate, { startIndex: 0, endIndex: 48000 }, null, false)).toMatchObject({ windowFrom: 'default', lowestHz: 100, spacingHz: Infinity })
  })
})
