import { describe, expect, it } from 'vitest'
import { guardPartials, type PhysicalBounds } from '../../../../shared/analysis/guardPartials'
import { trackReading } from '../../../support/partials'

const bounds: PhysicalBounds = { peakDb: -6, peakMarginDb: 1, sampleRate: 44100, minFrequencyHz: 20, spanS: 4, maxDecayDbPerS: 6000, maxGrowthDbPerS: 1 }

describe('guardPartials', () => {
  it('keeps readings inside the band the recording holds, clear of 0 Hz by half the main lobe', () => {
    const { kept, warnings } = guardPartials([
      trackReading({ frequencyHz: 22049 }),
      trackReading({ frequencyHz: 22050 }), // source: Nyquist frequency = fs / 2 = 22 050 Hz at 44.1 kHz
      trackReading({ frequencyHz: 45, windowS: 0.1 }), // source: Harris (1978), main lobe ±4 bins = 40 Hz for 0.1 s
      trackReading({ frequencyHz: 35, windowS: 0.1 }),
    ], bounds)
    expect(kept.map(p => p.frequencyHz)).toEqual([22049, 45])
    expect(warnings).toEqual(['2 partial readings left out: frequency outside the band the recording holds (or too close to 0 Hz for its window)'])
  })

  it('names a low reading a short recording could not tell from 0 Hz, with the length that would', () => {
    // A marimba bar's 61 Hz fundamental recorded for 0.2 s: the window is at most a third of the
    // span; the 0.06 s one used has a main lobe of ±4 bins (Harris 1978) = ±66.7 Hz around 0 Hz.
    const short = { ...bounds, spanS: 0.2 }
    const { kept, warnings, advice } = guardPartials([
      trackReading({ frequencyHz: 61, windowS: 0.06 }),
      trackReading({ frequencyHz: 12, windowS: 0.06 }),
      trackReading({ frequencyHz: 244, windowS: 0.06 }),
    ], short)
    expect(kept.map(p => p.frequencyHz)).toEqual([244])
    // source: 3 windows of 1.25 main lobes (10 / 61 Hz = 0.164 s) = 0.49 s, given up to the next 0.1 s
    expect(advice).toEqual(['61.00 Hz is in the recording but could not be measured: the 0.20 s after the strike is too short to tell so low a partial from 0 Hz; record at least 0.5 s after the strike'])
    // Under the analysed range it is no partial of the piece, however long the recording.
    expect(warnings).toContain('1 partial reading left out: frequency outside the band the recording holds (or too close to 0 Hz for its window)')
    // A long recording gets no such advice: its window was not limited by the span.
    expect(guardPartials([trackReading({ frequencyHz: 61, windowS: 0.06 })], bounds).advice).toEqual([])
  })

  it('leaves out readings louder than the file, growing, or decaying faster than it can show', () => {
    const { kept, warnings } = guardPartials([
      trackReading({ amplitudeDb: -4.9, strongestFrameDb: -4.9 }),
      trackReading({ decayDbPerS: -1.5 }),
      trackReading({ decayDbPerS: 7000 }),
      // 200 dB/s over 1.9 s is 380 dB, more than its 60 dB over the noise (+ 30 dB slack).
      trackReading({ decayDbPerS: 200 }),
      trackReading({ amplitudeDb: -5.1 }),
    ], bounds)
    expect(kept.map(p => p.amplitudeDb)).toEqual([-5.1])
    expect(warnings).toHaveLength(3)
  })

  it('reports a barely growing reading as steady, and an overshooting onset at its strongest frame', () => {
    const { kept, warnings } = guardPartials([
      trackReading({ frequencyHz: 300, decayDbPerS: -0.4 }),
      trackReading({ frequencyHz: 600, amplitudeDb: 2, strongestFrameDb: -12 }),
    ], bounds)
    expect(kept[0]).toMatchObject({ decayDbPerS: 0, t60S: null })
    expect(kept[1]!.amplitudeDb).toBe(-12)
    expect(warnings.join(' ')).toMatch(/^1 partial did not decay as one exponential/)
  })

  it('reports a reading whose rise stays within its modulation\'s swing as steady, at the level it swings about, and names it', () => {
    // A tremolo of 5.9 dB depth seen over 0.33 s (under one 2.9 Hz cycle) tilts the fitted line
    // up by 3.1 dB; a 2 dB swing cannot explain that rise, nor can a reading with no modulation.
    const swinging = { frequencyHz: 381.12, decayDbPerS: -9.4, startS: 0.81, endS: 1.14, modulationHz: 2.9, modulationFrom: 'envelope' as const, strongestFrameDb: -8 }
    const { kept, warnings } = guardPartials([
      trackReading({ ...swinging, modulationDepthDb: 5.9 }),
      trackReading({ ...swinging, frequencyHz: 700, modulationDepthDb: 2 }),
      trackReading({ ...swinging, frequencyHz: 900, modulationDepthDb: null, modulationHz: null }),
    ], bounds)
    expect(kept).toHaveLength(1)
    // source: the envelope swings ±depth/2 about its middle, so the middle is the strongest frame − 5.9/2 dB
    expect(kept[0]).toMatchObject({ frequencyHz: 381.12, decayDbPerS: 0, t60S: null, amplitudeDb: -8 - 2.95 })
    expect(warnings).toContain('the decay of 381.12 Hz (over 0.33 s) could not be read: the level swings with its modulation over the span measured, so it is given as 0 dB/s; a longer recording of the strike reads it')
    expect(warnings).toContain('2 partial readings left out: level growing instead of decaying')
  })
})
