import { describe, expect, it } from 'vitest'
import { AnalysisError } from '../../../../shared/analysis/AnalysisError'
import { analyzeChannels } from '../../../../shared/analysis/analyzeChannels'
import { checkWorkDeadline, startWorkDeadline } from '../../../../shared/analysis/workDeadline'
import { synthStrike } from '../../../../shared/synthesis/synthStrike'

const waitMs = (ms: number) => {
  const end = performance.now() + ms
  while (performance.now() < end) { /* busy: the limit is checked synchronously */ }
}

describe('workDeadline', () => {
  it('passes within the limit, refuses past it with the engine\'s 422, and lifts again', () => {
    expect(() => checkWorkDeadline()).not.toThrow()
    const lift = startWorkDeadline(0.005)
    expect(() => checkWorkDeadline()).not.toThrow()
    waitMs(10)
    const error = (() => {
      try {
        checkWorkDeadline()
      }
      catch (e) {
        return e
      }
    })()
    expect(error).toBeInstanceOf(AnalysisError)
    expect(error).toMatchObject({ status: 422, code: 'too_slow_to_measure' })
    expect((error as Error).message).toMatch(/took longer than 0\.005 s and was stopped/)
    lift()
    expect(() => checkWorkDeadline()).not.toThrow()
  })

  it('keeps an earlier limit when a later, longer one starts inside it', () => {
    const outer = startWorkDeadline(0.005)
    const inner = startWorkDeadline(60)
    waitMs(10)
    expect(() => checkWorkDeadline()).toThrow(AnalysisError)
    inner()
    outer()
    expect(() => checkWorkDeadline()).not.toThrow()
  })

  it('stops a whole measurement of a dense recording between partials, and the next one runs', () => {
    // 400 decaying partials 22.2 Hz apart: far more than a struck piece holds.
    const dense = synthStrike(Array.from({ length: 400 }, (_, i) => ({ frequencyHz: 60 + 22.2 * i, amplitudeDb: -30 - (i % 23), decayDbPerS: 1 + (i % 11) })), { sampleRate: 48000, durationS: 3, noiseDb: -90, seed: 4 })
    const lift = startWorkDeadline(0.001)
    try {
      expect(() => analyzeChannels([dense], 48000)).toThrow(expect.objectContaining({ code: 'too_slow_to_measure' }))
    }
    finally {
      lift()
    }
    expect(analyzeChannels([dense], 48000).partials.length).toBeGreaterThan(100)
  }, 60_000)
})
