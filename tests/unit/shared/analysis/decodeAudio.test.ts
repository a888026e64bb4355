import { describe, expect, it } from 'vitest'
import { analyzeStrike } from '../../../../shared/analysis/analyzeStrike'
import { decodeAudio, truncationWarning } from '../../../../shared/analysis/decodeAudio'
import { readWavHeader } from '../../../../shared/analysis/readWavHeader'
import { flacBomb, opusBomb } from '../../../support/audioBombs'
import { synthStrike } from '../../../support/synthStrike'
import { writeWav } from '../../../support/writeWav'

async function refusal(bytes: Uint8Array) {
  return decodeAudio(bytes).then(() => null, (e: unknown) => e as { status: number, code: string, message: string })
}

describe('decodeAudio: limits from the header, before decoding', () => {
  it('refuses a 81-byte FLAC that declares two hours (STREAMINFO) with 422', async () => {
    const error = await refusal(flacBomb({ declaredFrames: 48000 * 7200, blocks: 3 }))
    expect(error).toMatchObject({ status: 422, code: 'too_long' })
    expect(error!.message).toMatch(/says it lasts 7200\.0 s/)
  })

  it('refuses an Ogg Opus whose last granule states two hours with 422', async () => {
    expect(await refusal(opusBomb({ declaredFrames: 48000 * 7200, pages: 1 }))).toMatchObject({ status: 422, code: 'too_long' })
  })

  it('refuses nine channels (OpusHead) or a 250 kHz rate (STREAMINFO) stated in a header', async () => {
    expect(await refusal(opusBomb({ declaredFrames: 48000, pages: 1, channels: 9 }))).toMatchObject({ status: 422, code: 'too_many_channels' })
    const fast = flacBomb({ declaredFrames: 48000, blocks: 1 })
    // The 20-bit rate starts at file offset 18 (4 magic + 4 block header + 10).
    fast[18] = (250000 >> 12) & 0xff
    fast[19] = (250000 >> 4) & 0xff
    fast[20] = ((250000 & 0x0f) << 4) | (fast[20]! & 0x0f)
    expect(await refusal(fast)).toMatchObject({ status: 422, code: 'bad_sample_rate' })
  })

  it('refuses containers outside WAV, FLAC, AIFF, MP3 and Ogg without decoding them', async () => {
    // Core Audio Format: 'caff', version 1 (Apple CAF specification, from memory).
    const caf = new TextEncoder().encode('caff\0\x01\0\0desc\0\0\0\0\0\0\0\x20')
    expect(await refusal(caf)).toMatchObject({ status: 415, code: 'not_audio' })
    // An AIFF whose COMM chunk is cut off is refused as damaged, unread.
    const aiff = new TextEncoder().encode('FORM\0\0\0\x40AIFFCOMM\0\0\0\x12\0\x01')
    expect(await refusal(aiff)).toMatchObject({ status: 415, code: 'corrupt_audio' })
  })
})

describe('decodeAudio: a WAV cut short', () => {
  it('measures the part present and says the file is truncated', async () => {
    const tone = synthStrike([{ frequencyHz: 440, amplitudeDb: -8, decayDbPerS: 10, phaseRad: 0 }], { sampleRate: 48000, durationS: 10, onsetS: 0.05 })
    const whole = writeWav([tone], 48000)
    const cut = whole.slice(0, 44 + 48000 * 2 / 2) // 0.5 s of 10 s
    const decoded = await decodeAudio(cut)
    expect(decoded.channelData[0]!.length).toBe(24000)
    expect(decoded.warnings).toEqual([expect.stringMatching(/truncated WAV file: the header declares 10\.00 s .* holds 0\.50 s/)])
    const result = await analyzeStrike(cut)
    expect(result.warnings[0]).toMatch(/^truncated WAV file/)
    expect((await decodeAudio(whole)).warnings).toEqual([])
  })

  it('reads a WAV whose data size is 0 (a recorder stopped before writing it) to the end, and says so', async () => {
    const x = Float64Array.from({ length: 48000 }, (_, i) => 0.5 * Math.exp(-i / 24000) * Math.sin((2 * Math.PI * 440 * i) / 48000))
    const bytes = writeWav([x], 48000, 'pcm16', { declaredDataBytes: 0 })
    expect(readWavHeader(bytes)).toMatchObject({ dataBytes: 0, dataBytesPresent: 96000, frames: 48000 })
    const decoded = await decodeAudio(bytes)
    expect(decoded.channelData[0]!.length).toBe(48000)
    expect(decoded.warnings).toEqual(['the WAV header states no length for its audio (the recorder may not have finished the file); it was read to the end of the file'])
    const result = await analyzeStrike(bytes)
    expect(result.partials.map(p => Math.round(p.frequencyHz))).toEqual([440])
    // A streaming recorder's 0xFFFFFFFF is read to the end without a word, as before.
    expect((await decodeAudio(writeWav([x], 48000, 'pcm16', { declaredDataBytes: 0xffffffff }))).warnings).toEqual([])
  })

  it('takes 0 and 0xFFFFFFFF data sizes for a streaming recorder, not a truncation', () => {
    expect(truncationWarning(0, 1000, 2, 48000)).toBeNull()
    expect(truncationWarning(0xffffffff, 1000, 2, 48000)).toBeNull()
    expect(truncationWarning(1000, 1000, 2, 48000)).toBeNull()
    expect(truncationWarning(2000, 1000, 2, 48000)).toMatch(/truncated/)
  })
})
