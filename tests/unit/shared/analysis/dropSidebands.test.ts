import { describe, expect, it } from 'vitest'
import { dropSidebands } from '../../../../shared/analysis/dropSidebands'
import { trackReading } from '../../../support/partials'

describe('dropSidebands', () => {
  it('leaves out the k·f_m sidebands of a vibrato (modulation theorem)', () => {
    // A freepats glockenspiel G5 vibrato: sidebands 6.75 Hz apart (tests/fixtures/real/README.md).
    const carrier = trackReading({ frequencyHz: 784, amplitudeDb: -30, modulationHz: 6.75, modulationFrom: 'sidebands' })
    const kept = dropSidebands([carrier, trackReading({ frequencyHz: 784 + 2 * 6.75, amplitudeDb: -50 }), trackReading({ frequencyHz: 2124, amplitudeDb: -50 })])
    expect(kept.map(p => p.frequencyHz)).toEqual([784, 2124])
  })

  it('takes no rate faster than a tremolo or a sample loop for a modulation', () => {
    // A 25 ms band reads two peaks inside one main lobe 155 Hz apart: no modulation of a partial,
    // so a real partial 4 × 155 Hz away (a tabla stroke's 838 Hz beside 1455 Hz) stays.
    const fast = trackReading({ frequencyHz: 1455, amplitudeDb: -5, modulationHz: 155.2, modulationFrom: 'sidebands' })
    const other = trackReading({ frequencyHz: 1455 - 4 * 155.2, amplitudeDb: -17 })
    expect(dropSidebands([fast, other])).toHaveLength(2)
  })
})

describe('dropSidebands judges levels by what the frames saw too', () => {
  // A vibraphone F3 with an 8 Hz tremolo, recorded 6 dB too hot and hard-clipped (the readings
  // of tests/support/recordingConditions.ts): a short band's track on the lower sideband drew
  // its onset amplitude back to +0.97 dB from frames no stronger than −41.6 dB.
  const carrier = trackReading({ frequencyHz: 174.65, amplitudeDb: 0.12, strongestFrameDb: -1.07, modulationHz: 8, modulationFrom: 'sidebands' })
  const overshoot = trackReading({ frequencyHz: 166.65, amplitudeDb: 0.97, strongestFrameDb: -41.6, modulationHz: 8, modulationFrom: 'sidebands' })
  const upper = trackReading({ frequencyHz: 182.65, amplitudeDb: -13.2, strongestFrameDb: -14.7 })

  it('keeps the carrier and leaves out both sidebands, whichever order they come in', () => {
    expect(dropSidebands([overshoot, carrier, upper]).map(p => p.frequencyHz)).toEqual([174.65])
    expect(dropSidebands([upper, carrier, overshoot]).map(p => p.frequencyHz)).toEqual([174.65])
  })

  it('never takes a partial seen more than 6 dB stronger in a frame for a sideband', () => {
    const strongFrames = trackReading({ frequencyHz: 182.65, amplitudeDb: -13.2, strongestFrameDb: 5 })
    expect(dropSidebands([carrier, strongFrames])).toHaveLength(2)
  })
})

describe('dropSidebands applies the strike\'s tremolo to every partial', () => {
  // A vibraphone F3 with a 10 Hz tremolo (tests/support/recordingConditions.ts): the fundamental's
  // spectrum showed the sidebands, the ×10's did not, and the 0.5 s window read its pair at ±10 Hz.
  const fundamental = trackReading({ frequencyHz: 174.65, amplitudeDb: -7.8, strongestFrameDb: -9, modulationHz: 10, modulationFrom: 'sidebands' })
  const tenth = trackReading({ frequencyHz: 1746.9, amplitudeDb: -30.3, strongestFrameDb: -32 })
  const lower = trackReading({ frequencyHz: 1736.9, amplitudeDb: -42.2, strongestFrameDb: -44 })
  const upper = trackReading({ frequencyHz: 1756.9, amplitudeDb: -42.2, strongestFrameDb: -44 })

  it('leaves out a symmetric pair at ± that rate around a partial that did not show it', () => {
    expect(dropSidebands([fundamental, tenth, lower, upper]).map(p => p.frequencyHz)).toEqual([174.65, 1746.9])
  })

  it('keeps a single neighbour at that distance (a mode, not a sideband pair) and pairs at other rates', () => {
    expect(dropSidebands([fundamental, tenth, upper])).toHaveLength(3)
    const at13 = [trackReading({ frequencyHz: 1733.9, amplitudeDb: -42.2, strongestFrameDb: -44 }), trackReading({ frequencyHz: 1759.9, amplitudeDb: -42.2, strongestFrameDb: -44 })]
    expect(dropSidebands([fundamental, tenth, ...at13])).toHaveLength(4)
  })
})

describe('dropSidebands: a pair is only a tremolo\'s sidebands with a tremolo\'s levels', () => {
  it('keeps uneven neighbours (a bell\'s 2419.9 and 2435.4 Hz, 9.5 dB apart) and pairs too close to the carrier\'s level', () => {
    const tremolo = trackReading({ frequencyHz: 900, amplitudeDb: -20, strongestFrameDb: -22, modulationHz: 7.75, modulationFrom: 'sidebands' })
    const carrier = trackReading({ frequencyHz: 2427.67, amplitudeDb: -30, strongestFrameDb: -32 })
    const uneven = [trackReading({ frequencyHz: 2419.92, amplitudeDb: -41.1, strongestFrameDb: -43 }), trackReading({ frequencyHz: 2435.42, amplitudeDb: -50.6, strongestFrameDb: -52 })]
    expect(dropSidebands([tremolo, carrier, ...uneven])).toHaveLength(4)
    const tooStrong = [trackReading({ frequencyHz: 2419.92, amplitudeDb: -33, strongestFrameDb: -35 }), trackReading({ frequencyHz: 2435.42, amplitudeDb: -33, strongestFrameDb: -35 })]
    expect(dropSidebands([tremolo, carrier, ...tooStrong])).toHaveLength(4)
    const even = [trackReading({ frequencyHz: 2419.92, amplitudeDb: -42, strongestFrameDb: -44 }), trackReading({ frequencyHz: 2435.42, amplitudeDb: -43, strongestFrameDb: -45 })]
    expect(dropSidebands([tremolo, carrier, ...even])).toHaveLength(2)
  })
})
