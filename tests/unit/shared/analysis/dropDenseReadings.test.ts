import { describe, expect, it } from 'vitest'
import { dropDuplicates } from '../../../../shared/analysis/dropDuplicates'
import { dropSidebands } from '../../../../shared/analysis/dropSidebands'
import { ENGINE_SETTINGS } from '../../../../shared/analysis/engineSettings'
import type { TrackMeasurement } from '../../../../shared/analysis/measureTrack'
import { trackReading } from '../../../support/partials'
import { seededRandom } from '../../../support/seededRandom'

// dropSidebands and dropDuplicates look only near each reading (binary search by frequency), so a
// dense recording (a cymbal read as hundreds of partials) costs little. Their answer must be the
// one a scan of every pair gives: the rules as their doc comments state them, written plainly here.

function everyPairDuplicates(measured: readonly TrackMeasurement[]): TrackMeasurement[] {
  const byLength = [...measured].sort((a, b) => b.frames - a.frames || b.amplitudeDb - a.amplitudeDb)
  const kept: TrackMeasurement[] = []
  for (const m of byLength) {
    if (!kept.some(k => Math.abs(k.frequencyHz - m.frequencyHz) < 1 / Math.min(k.refineSpanS, m.refineSpanS))) kept.push(m)
  }
  return kept.sort((a, b) => a.frequencyHz - b.frequencyHz)
}

/** Dense, clustered readings: carriers with modulation, sidebands at k·rate, near-duplicates. */
function denseReadings(seed: number, count: number): TrackMeasurement[] {
  const { uniform: random } = seededRandom(seed)
  const out: TrackMeasurement[] = []
  for (let i = 0; i < count; i++) {
    const base = out.length > 0 && random() < 0.6 ? out[Math.floor(random() * out.length)]! : null
    const rate = [4, 6.75, 8, 17.5][Math.floor(random() * 4)]!
    const frequencyHz = base ? base.frequencyHz + Math.round(random() * 8 - 4) * (base.modulationHz ?? rate) + (random() - 0.5) * 0.6 : 100 + random() * 4000
    out.push(trackReading({
      frequencyHz,
      amplitudeDb: -10 - random() * 60,
      strongestFrameDb: -12 - random() * 60,
      frames: 2 + Math.floor(random() * 80),
      refineSpanS: 0.05 + random() * 2,
      modulationHz: random() < 0.4 ? rate : null,
      modulationFrom: random() < 0.4 ? 'sidebands' : random() < 0.5 ? 'pair' : null,
    }))
  }
  return out
}

describe('dropSidebands and dropDuplicates on dense readings', () => {
  it('dropDuplicates keeps exactly what a scan of every pair keeps, in frequency order', () => {
    for (let seed = 1; seed <= 40; seed++) {
      const readings = denseReadings(seed, 300)
      expect(dropDuplicates(readings)).toEqual(everyPairDuplicates(readings))
    }
  })

  it('dropSidebands leaves out the k·rate sidebands found by frequency and keeps the rest in their order', () => {
    for (let seed = 1; seed <= 40; seed++) {
      const readings = denseReadings(100 + seed, 300)
      const kept = dropSidebands(readings)
      const left = readings.filter(r => !kept.includes(r))
      // Order kept, and nothing stronger than its carrier is dropped: every reading left out lies
      // k·rate from a reading that stays (sidebandOf: the rule as dropSidebands states it).
      expect(kept).toEqual(readings.filter(r => kept.includes(r)))
      for (const r of left) {
        const near = kept.some(c => [4, 6.75, 8, 17.5].some(rate => sidebandOf(r, c, rate)))
        expect(near, `${r.frequencyHz} Hz left out with no carrier`).toBe(true)
      }
      // And nothing that is a sideband stays: no kept reading, weaker on both levels than a kept
      // carrier whose own spectrum showed sidebands, lies k·rate from it.
      for (const c of kept.filter(c => c.modulationFrom === 'sidebands' && c.modulationHz !== null && c.modulationHz <= 2 * ENGINE_SETTINGS.modulation.maxRateHz)) {
        const rate = c.modulationHz!
        for (const r of kept) {
          if (r === c || !(r.amplitudeDb < c.amplitudeDb && r.strongestFrameDb <= c.strongestFrameDb)) continue
          const sideband = sidebandOf(r, c, rate)
          expect(sideband, `${r.frequencyHz} Hz kept beside ${c.frequencyHz} Hz at ${rate} Hz`).toBe(false)
        }
      }
    }
  })
})

/**
 * The sideband rule, written out apart from the code: k·rate from the carrier for k = 1…6 within
 * 0.3 Hz or 5 % of the rate (0.3 of the rate for a shoulder inside the carrier's main lobe, 6 dB
 * or more under it), and k = 7…16 when 20 dB or more under the carrier.
 */
function sidebandOf(r: TrackMeasurement, c: TrackMeasurement, rate: number): boolean {
  const order = Math.abs(r.frequencyHz - c.frequencyHz) / rate
  const k = Math.round(order)
  const belowDb = c.amplitudeDb - r.amplitudeDb
  const inLobe = k * rate < 5 / c.windowS && belowDb >= 6
  const tolHz = Math.max(0.3, 0.05 * rate, inLobe ? 0.3 * rate : 0)
  return k >= 1 && (k <= 6 || (k <= 16 && belowDb >= 20)) && Math.abs(order - k) * rate <= tolHz
}
