import { describe, expect, it } from 'vitest'
import { windowLayout } from '../../../../shared/analysis/windowLayout'

describe('windowLayout', () => {
  it('zero-pads to the next power of two at least twice the window, and gives both lengths in seconds', () => {
    // source: arithmetic — 2 × 24 000 = 48 000 ≤ 2¹⁶ = 65 536; 24 000 / 48 000 Hz = 0.5 s; 6 000 / 48 000 Hz = 0.125 s
    expect(windowLayout(24000, 6000, 48000)).toEqual({ windowLength: 24000, fftSize: 65536, hop: 6000, windowS: 0.5, hopS: 0.125, zeroPad: 65536 / 24000 })
    // source: arithmetic — 2 × 1 024 = 2¹¹ exactly, so the padding is exactly 2
    expect(windowLayout(1024, 256, 44100)).toMatchObject({ fftSize: 2048, zeroPad: 2, windowS: 1024 / 44100, hopS: 256 / 44100 })
    // source: arithmetic — 2 × 1 025 = 2 050 > 2¹¹, so 2¹² = 4 096
    expect(windowLayout(1025, 256, 44100).fftSize).toBe(4096)
  })

  it('refuses a fractional or empty window or hop and a rate that is not positive', () => {
    expect(() => windowLayout(100.5, 25, 48000)).toThrow(RangeError)
    expect(() => windowLayout(0, 25, 48000)).toThrow(RangeError)
    expect(() => windowLayout(100, 0, 48000)).toThrow(RangeError)
    expect(() => windowLayout(100, 25, 0)).toThrow(RangeError)
  })
})
