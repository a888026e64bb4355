import { describe, expect, it } from 'vitest'
import { assembleResult } from '../../../../shared/analysis/assembleResult'
import { findStrike } from '../../../../shared/analysis/findStrike'
import { ENGINE_VERSION } from '../../../../shared/analysis/version'
import { planAnalysis } from '../../../../shared/analysis/planAnalysis'
import { synthStrike } from '../../../support/synthStrike'

describe('assembleResult', () => {
  it('states the file, the span and the parameters, with no verdict before the template is applied', () => {
    const sampleRate = 44100
    const x = synthStrike([{ frequencyHz: 440, amplitudeDb: -6, decayDbPerS: 10 }], { sampleRate, durationS: 2, onsetS: 0.1, noiseDb: -80, seed: 8 })
    const strike = findStrike(x, sampleRate, { attackSkipS: 0.005 })
    const plan = planAnalysis(x, sampleRate, strike, null, undefined)
    const measured = [{ partials: [], frames: [], trackJumpCents: 12, minTrackFrames: 6 }]
    const notes = { warnings: ['clipped samples: 3', 'a technical note'], advice: ['clipped samples: 3'] }
    const result = assembleResult([], notes, { sampleRate, channels: 2, samples: x.length, strike, plan, measured, attackSkipS: 0.005, dynamicRangeDb: 80 })
    expect(result).toMatchObject({
      engineVersion: ENGINE_VERSION, sampleRate, channels: 2, durationS: 2, fundamentalHz: null, verdict: null, guidance: [], warnings: ['clipped samples: 3', 'a technical note'], advice: ['clipped samples: 3'],
    })
    expect(result.onsetS).toBe(strike.onsetIndex / sampleRate)
    expect(result.analysisStartS).toBe(strike.startIndex / sampleRate)
    expect(result.analysisEndS).toBe(strike.endIndex / sampleRate)
    expect(result.parameters).toMatchObject({ windowS: plan.bands[0]!.windowS, dynamicRangeDb: 80, trackJumpCents: 12, minTrackFrames: 6, windowFrom: 'rough-pass' })
    expect(result.parameters.bands).toHaveLength(plan.bands.length)
  }, 60_000)
})
