import { describe, expect, it } from 'vitest'
import { wandersOverLobe } from '../../../../shared/analysis/wandersOverLobe'

const reading = { frequencyHz: 10_000, windowS: 0.5, modulationFrom: null, modulationHz: null } as const

describe('wandersOverLobe', () => {
  it('draws the line at a quarter of a Blackman–Harris main lobe: 2 bins of the window', () => {
    // 0.5 s window: a bin is 2 Hz, 2 bins 4 Hz; at 10 kHz, 4 Hz is 1200·log2(1.0004) = 0.6924 ¢.
    // source: Harris 1978 (Blackman–Harris main lobe ±4 bins) and the cents identity
    expect(wandersOverLobe({ ...reading, stabilityCents: 0.69 })).toBe(false)
    expect(wandersOverLobe({ ...reading, stabilityCents: 0.70 })).toBe(true)
  })

  it('allows a vibrato\'s swing, √2 × its rate, where its sidebands were seen, and only then', () => {
    // 14 Hz vibrato: up to 19.8 Hz of RMS spread; 18 Hz at 10 kHz is 3.114 ¢. source: the cents identity
    const swinging = { ...reading, stabilityCents: 3.1, modulationHz: 14 }
    expect(wandersOverLobe({ ...swinging, modulationFrom: 'sidebands' })).toBe(false)
    expect(wandersOverLobe({ ...swinging, modulationFrom: 'envelope' })).toBe(true)
  })
})
