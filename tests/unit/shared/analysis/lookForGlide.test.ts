import { describe, expect, it } from 'vitest'
import { analyzeChannels } from '../../../../shared/analysis/analyzeChannels'
import { lookForGlide } from '../../../../shared/analysis/lookForGlide'
import { seededRandom } from '../../../support/seededRandom'

const RATE = 48000

/**
 * A drum stroke whose pitch moves along `pitchHz(t)` (phase integrated sample by sample),
 * with a steady second mode, decaying, after 0.05 s of silence, over seeded noise at −80 dB.
 */
function glidingStroke(pitchHz: (timeS: number) => number, durationS = 1.5): Float64Array {
  const noise = seededRandom(11)
  const out = new Float64Array(Math.round(durationS * RATE))
  const onset = Math.round(0.05 * RATE)
  let phase = 0
  for (let n = 0; n < out.length; n++) {
    out[n] = 1e-4 * noise.normal()
    if (n < onset) continue
    const t = (n - onset) / RATE
    phase += (2 * Math.PI * pitchHz(t)) / RATE
    out[n]! += 0.7 * 10 ** ((-20 * t) / 20) * Math.sin(phase) + 0.1 * 10 ** ((-30 * t) / 20) * Math.sin(2 * Math.PI * 231.7 * t)
  }
  return out
}

describe('lookForGlide (through analyzeChannels)', () => {
  it('names a tom\'s falling pitch and where it is reported', () => {
    // A hard blow raises a head's tension, so its pitch falls as it rings (common practice among
    // drum makers): here 108 Hz to 91 Hz, settling with a time constant of 0.12 s.
    const result = analyzeChannels([glidingStroke(t => 91 + 17 * Math.exp(-t / 0.12))], RATE, {})
    const warning = result.warnings.find(w => w.includes('glides in pitch'))
    expect(warning).toMatch(/from 1\d\d\.\d Hz to 9\d\.\d Hz over/)
    expect(warning).toMatch(/it is reported where it settles, at 9[01]\.\d Hz$/)
  })

  it('says a reading inside the glide is an average over it, not a pitch the head holds', () => {
    // A bass head pressed while it rings: 103 Hz up to 137 Hz within 0.15 s, then easing back.
    const pressed = (t: number) => (t < 0.15 ? 103 + (34 * t) / 0.15 : 137 - 40 * (t - 0.15))
    const result = analyzeChannels([glidingStroke(pressed, 0.8)], RATE, {})
    const warning = result.warnings.find(w => w.includes('glides in pitch'))
    const reading = result.partials.find(p => p.frequencyHz > 100 && p.frequencyHz < 140)
    expect(reading).toBeDefined()
    expect(warning).toContain(`the reading at ${reading!.frequencyHz.toFixed(1)} Hz is an average over the glide, not a pitch the piece holds`)
  })

  it('says nothing of a drum that holds its pitch', () => {
    const result = analyzeChannels([glidingStroke(() => 98.4)], RATE, {})
    expect(result.warnings.join(' ')).not.toMatch(/glides in pitch/)
    // source: the synthesis above, a steady 98.4 Hz
    expect(result.partials.some(p => Math.abs(p.frequencyHz - 98.4) < 0.01)).toBe(true)
  })

  it('looks again where the loudest reading is reported but its frames spread, as a glide the long frames stepped over does', () => {
    // A bass head pressed at the blow and let go: 121 Hz easing to 91 Hz over 0.3 s (a tabla's
    // bass stroke, common practice). The long window's one frame saw only where it settles.
    const signal = glidingStroke(t => 91 + 30 * Math.exp(-t / 0.1))
    const onsetIndex = Math.round(0.05 * RATE)
    const strike = { onsetIndex, startIndex: onsetIndex + 240, endIndex: signal.length, noiseFloorDb: -80, peakDb: -3, peakIndex: onsetIndex + 500 }
    const long = { frames: [{ timeS: 0.3, peaks: [{ frequencyHz: 91.3, amplitudeDb: -4, noiseFloorDb: -90, phaseRad: 0 }] }], windowS: 0.46 }
    // Its frames spread 22 cents about it (RMS): looked at again, the glide is found.
    const range = { minHz: 20, maxHz: 20000 }
    const glide = lookForGlide(signal, RATE, strike, long, [{ frequencyHz: 91.3, stabilityCents: 22 }], range)
    expect(glide).not.toBeNull()
    expect(glide!.highestHz).toBeGreaterThan(110)
    expect(glide!.toHz).toBeLessThan(95)
    // A steady reading there is not looked at again (a struck bar's frames mostly spread a few cents).
    expect(lookForGlide(signal, RATE, strike, long, [{ frequencyHz: 91.3, stabilityCents: 0.4 }], range)).toBeNull()
  })
})
