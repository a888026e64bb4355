import decode from 'audio-decode'
import { describe, expect, it } from 'vitest'
import { AnalysisError } from '../../../../shared/analysis/AnalysisError'
import { decodeBounded } from '../../../../shared/analysis/decodeBounded'
import { flacBomb, opusBomb } from '../../../support/audioBombs'
import { audioFixture } from '../../../support/audioFixture'

const fixture = audioFixture

describe('decodeBounded', () => {
  it.each([
    ['strike-48k.flac', 'flac'],
    ['strike-96k.flac', 'flac'],
    ['strike-48k.ogg', 'vorbis'],
    ['strike-44k1.mp3', 'mp3'],
    ['strike-44k1-24bit.wav', 'wav'],
  ] as const)('decoding %s in slices gives the same samples as audio-decode on the whole file', async (name, codec) => {
    const bytes = fixture(name)
    const whole = await decode(bytes)
    const sliced = await decodeBounded(bytes, codec)
    expect(sliced.sampleRate).toBe(whole.sampleRate)
    expect(sliced.channelData.length).toBe(whole.channelData.length)
    expect(sliced.channelData[0]!.length).toBe(whole.channelData[0]!.length)
    expect(Array.from(sliced.channelData[0]!)).toEqual(Array.from(whole.channelData[0]!))
  })

  it('decodes exactly what a hand-written FLAC holds (CONSTANT subframes: value / 2^15)', async () => {
    const out = await decodeBounded(flacBomb({ declaredFrames: 96000, blocks: 2, blockSize: 48000, value: 1000 }), 'flac')
    expect(out.sampleRate).toBe(48000)
    expect(out.channelData[0]!.length).toBe(96000)
    // source: RFC 9639 §9.2.3, a CONSTANT subframe repeats one sample; 16-bit full scale is 2^15.
    expect(out.channelData[0]![95999]).toBeCloseTo(1000 / 32768, 4)
  })

  it('stops a FLAC that hides 23 minutes in 14 kB (no length stated) as soon as it passes 60 s', async () => {
    const bomb = flacBomb({ declaredFrames: 0, blocks: 1000, blockSize: 65535 })
    expect(bomb.length).toBeLessThan(16_000)
    const error = await decodeBounded(bomb, 'flac').catch(e => e)
    expect(error).toBeInstanceOf(AnalysisError)
    expect(error).toMatchObject({ status: 422, code: 'too_long' })
  })

  it('stops an Ogg Opus whose last granule says 1 s but whose packets run for minutes', async () => {
    // 40 pages × 250 packets × 20 ms = 200 s.
    const error = await decodeBounded(opusBomb({ declaredFrames: 48000, pages: 40 }), 'opus').catch(e => e)
    expect(error).toMatchObject({ status: 422, code: 'too_long' })
  })
})
