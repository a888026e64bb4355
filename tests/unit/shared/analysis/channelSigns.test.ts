import { describe, expect, it } from 'vitest'
import { channelSigns } from '../../../../shared/analysis/channelSigns'
import { mixToMono } from '../../../../shared/analysis/mixToMono'

const tone = (gain: number, offset = 0) => Float64Array.from({ length: 4800 }, (_, i) => offset + gain * Math.sin((2 * Math.PI * 440 * i) / 48000))

describe('channelSigns', () => {
  it('keeps channels in the same polarity as the loudest', () => {
    expect(channelSigns([tone(0.5), tone(0.3)])).toEqual([1, 1])
    expect(channelSigns([tone(0.5)])).toEqual([1])
  })

  it('inverts a channel of opposite polarity, whichever is louder', () => {
    expect(channelSigns([tone(0.5), tone(-0.5)])).toEqual([1, -1])
    expect(channelSigns([tone(-0.2), tone(0.6), tone(0.4)])).toEqual([-1, 1, 1])
  })

  it('judges polarity about each channel\'s mean (a DC offset does not count as correlation)', () => {
    expect(channelSigns([tone(0.4, 0.3), tone(-0.3, 0.3)])).toEqual([1, -1])
  })

  it('leaves out a channel 40 dB or more under the loudest, keeps one 30 dB under', () => {
    // 40 dB in energy is a gain of 0.01 (source: the decibel, 10·log10 of a power ratio).
    expect(channelSigns([tone(0.5), tone(0.5 * 0.009)])).toEqual([1, 0])
    expect(channelSigns([tone(0.5), tone(0.5 * 0.0316)])).toEqual([1, 1])
    expect(channelSigns([new Float64Array(4800), tone(0.5)])).toEqual([0, 1])
  })

  it('refuses no channels', () => {
    expect(() => channelSigns([])).toThrow(RangeError)
  })
})

describe('mixToMono with signs', () => {
  it('an inverted pair mixes to the signal, a left-out channel does not halve it', () => {
    const a = tone(0.5)
    const inverted = mixToMono([a, a.map(v => -v)], [1, -1])
    const withDead = mixToMono([a, new Float64Array(a.length)], [1, 0])
    for (let i = 0; i < a.length; i += 97) {
      expect(inverted[i]).toBeCloseTo(a[i]!, 15)
      expect(withDead[i]).toBe(a[i])
    }
    expect(() => mixToMono([a, a], [1])).toThrow(RangeError)
  })
})
