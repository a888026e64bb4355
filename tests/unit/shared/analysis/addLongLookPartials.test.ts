import { describe, expect, it } from 'vitest'
import { addLongLookPartials } from '../../../../shared/analysis/addLongLookPartials'
import { centsBetween } from '../../../../shared/analysis/centsBetween'
import { findStrike } from '../../../../shared/analysis/findStrike'
import { planAnalysis } from '../../../../shared/analysis/planAnalysis'
import { CLOSE_PAIR, LOW_MODES, reportedPartial } from '../../../support/closeLowPair'
import { synthStrike } from '../../../support/synthStrike'

const sampleRate = 48000
// Strong low modes and a pair 9 Hz apart that a 0.2 s window cannot resolve (tests/support/closeLowPair.ts).
const low = LOW_MODES
const pair = CLOSE_PAIR
const reported = reportedPartial
const level = { peakDb: 0, minAmplitudeDb: -90 }

function strikeOf(durationS: number, partials = [...low, ...pair]) {
  const x = synthStrike(partials, { sampleRate, durationS, onsetS: 0.05, noiseDb: -80, seed: 2 })
  const strike = findStrike(x, sampleRate, { attackSkipS: 0.005 })
  return { x, strike, plan: planAnalysis(x, sampleRate, strike, null, 0.2) }
}

describe('addLongLookPartials', () => {
  it('adds the pair the 0.2 s bands folded into one lobe, in frequency order, with a warning naming them', () => {
    const { x, strike, plan } = strikeOf(2)
    const out = addLongLookPartials(x, sampleRate, low.map(reported), strike, plan, level)
    expect(out.partials.map(p => Math.round(p.frequencyHz))).toEqual([88, 132, 250, 259])
    for (const truth of pair) {
      const p = out.partials.find(q => Math.abs(q.frequencyHz - truth.frequencyHz) < 1)!
      expect(Math.abs(centsBetween(p.frequencyHz, truth.frequencyHz))).toBeLessThan(0.1)
    }
    expect(out.warnings).toHaveLength(1)
    expect(out.warnings[0]).toContain('250.00 Hz, 259.00 Hz')
  }, 30_000)

  it('changes nothing without partials to compare with, or on a strike too short to resolve more than the bands', () => {
    const { x, strike, plan } = strikeOf(2)
    expect(addLongLookPartials(x, sampleRate, [], strike, plan, level)).toEqual({ partials: [], warnings: [] })
    // 0.3 s of sound, under twice the 0.2 s band window, holding a pair 30 Hz apart that 0.3 s
    // would resolve (main lobe 27 Hz) but the 0.2 s bands nearly do too (40 Hz): not worth a look.
    const short = strikeOf(0.35, [...low, { frequencyHz: 250, amplitudeDb: -32, decayDbPerS: 12 }, { frequencyHz: 280, amplitudeDb: -30, decayDbPerS: 15 }])
    expect(addLongLookPartials(short.x, sampleRate, low.map(reported), short.strike, short.plan, level)).toEqual({ partials: low.map(reported), warnings: [] })
  }, 30_000)

  it('adds nothing under the floor of the reported range', () => {
    const { x, strike, plan } = strikeOf(2)
    expect(addLongLookPartials(x, sampleRate, low.map(reported), strike, plan, { peakDb: 0, minAmplitudeDb: -25 }).partials).toHaveLength(2)
  }, 30_000)
})
