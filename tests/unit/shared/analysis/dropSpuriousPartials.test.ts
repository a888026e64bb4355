import { describe, expect, it } from 'vitest'
import { dropSpuriousPartials } from '../../../../shared/analysis/dropSpuriousPartials'
import { ENGINE_SETTINGS } from '../../../../shared/analysis/engineSettings'
import type { TrackMeasurement } from '../../../../shared/analysis/measureTrack'
import { trackReading } from '../../../support/partials'

const partial = (fields: Partial<TrackMeasurement>) => trackReading({ windowS: 0.5, ...fields })
const settings = { strongestDb: -10, ...ENGINE_SETTINGS.spurious }

describe('dropSpuriousPartials', () => {
  it('keeps decaying partials, weak ones and slowly decaying bells included', () => {
    const kept = dropSpuriousPartials([
      partial({}),
      // A tubular bell's mode, 3 dB/s (freepats tubular bells C5, tests/fixtures/real/README.md).
      partial({ frequencyHz: 646, amplitudeDb: -25, decayDbPerS: 3, r2: 0.85 }),
      // A weak partial 54 dB under the strongest but 75 dB over the noise (glockenspiel C7, 5678 Hz).
      partial({ frequencyHz: 5678, amplitudeDb: -64, decayDbPerS: 14, r2: 0.61, snrDb: 75, stabilityCents: 1.2 }),
    ], settings)
    expect(kept.kept).toHaveLength(3)
    expect(kept.warnings).toEqual([])
  })

  it('leaves out a track wandering over more than a quarter main lobe (2 bins of its window)', () => {
    // 10 kHz, window 0.5 s: a bin is 2 Hz, 2 bins 4 Hz (0.69 ¢); 10 ¢ at 10 kHz is 5.8 Hz.
    const wandering = partial({ frequencyHz: 10000, stabilityCents: 10 })
    const steadyEnough = partial({ frequencyHz: 10000, stabilityCents: 0.6 })
    const out = dropSpuriousPartials([wandering, steadyEnough], settings)
    expect(out.kept).toEqual([steadyEnough])
    expect(out.warnings.join(' ')).toMatch(/1 track not reported: frequency wandering/)
  })

  it('lets a partial with a vibrato (symmetric sidebands) swing by up to twice its rate', () => {
    // A freepats glockenspiel A6's 9065 Hz partial: 14.35 Hz vibrato, 0.125 s window (2 bins = 16 Hz),
    // frame frequencies spread (RMS) 3.4 ¢ = 17.8 Hz, a peak deviation of 17.8·√2 = 25 Hz < 2 × 14.35 Hz.
    // Up to index β = 2 the first sidebands stay the strongest: J1(2) = 0.5767 > J2(2) = 0.3528
    // (source: Abramowitz & Stegun, Handbook of Mathematical Functions, table 9.1).
    const vibrato = { frequencyHz: 9065, windowS: 0.125, stabilityCents: 3.4, modulationHz: 14.35 }
    const withSidebands = partial({ ...vibrato, modulationFrom: 'sidebands' })
    const beating = partial({ ...vibrato, modulationFrom: 'pair' })
    const tooWide = partial({ ...vibrato, stabilityCents: 6, modulationFrom: 'sidebands' }) // 31 Hz RMS, 44 Hz peak > 2 × 14.35 Hz
    const out = dropSpuriousPartials([withSidebands, beating, tooWide], settings)
    expect(out.kept).toEqual([withSidebands])
    expect(out.warnings.join(' ')).toMatch(/2 tracks not reported: frequency wandering/)
  })

  it('leaves out a steady line far under the strike, and faint readings barely over the noise', () => {
    const hum = partial({ frequencyHz: 100, amplitudeDb: -62, decayDbPerS: 0.2, r2: 0.05 })
    const strongSteady = partial({ frequencyHz: 784, amplitudeDb: -10, decayDbPerS: 1, r2: 0.58 }) // the strike's own strongest
    const faint = partial({ frequencyHz: 3793, amplitudeDb: -81, decayDbPerS: 85, snrDb: 28 })
    const out = dropSpuriousPartials([hum, strongSteady, faint], settings)
    expect(out.kept).toEqual([strongSteady])
    expect(out.warnings).toHaveLength(2)
  })

  it('leaves out hum\'s lines as steady lines but does not count them where the hum is named', () => {
    // 50 Hz mains and its 3rd harmonic (source: IEC 60038:2009, a 50 Hz supply) and a fan's 37 Hz whine.
    const line = (frequencyHz: number) => partial({ frequencyHz, amplitudeDb: -70, decayDbPerS: 0.1, r2: 0.02 })
    const strike = partial({ frequencyHz: 523.3, amplitudeDb: -10, decayDbPerS: 9, r2: 0.99 })
    const out = dropSpuriousPartials([line(50), line(150), line(37), strike], { ...settings, humLinesHz: [50, 150] })
    expect(out.kept).toEqual([strike])
    expect(out.warnings).toEqual(['1 steady line far under the strike not reported (hum or a recording artefact, not a decaying mode)'])
    expect(dropSpuriousPartials([line(50), line(150), strike], { ...settings, humLinesHz: [50, 150] }).warnings).toEqual([])
  })
})
