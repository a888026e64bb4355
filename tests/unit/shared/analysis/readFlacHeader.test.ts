import { describe, expect, it } from 'vitest'
import { readFlacHeader } from '../../../../shared/analysis/readFlacHeader'
import { flacBomb } from '../../../support/audioBombs'
import { audioFixture } from '../../../support/audioFixture'

const fixture = audioFixture

describe('readFlacHeader', () => {
  it('reads rate, channels and total samples of a file written by another encoder', () => {
    // scripts/make-test-audio.sh: 48 kHz mono, 1.0 s strike + 0.05 s pad = 50 400 samples (sox, libFLAC).
    expect(readFlacHeader(fixture('strike-48k.flac'))).toEqual({ codec: 'flac', channels: 1, sampleRate: 48000, frames: 50400, minDurationS: null })
    // 96 kHz, 0.5 s + 0.05 s = 52 800 samples.
    expect(readFlacHeader(fixture('strike-96k.flac'))).toMatchObject({ channels: 1, sampleRate: 96000, frames: 52800 })
  })

  it('reads a 36-bit total past 2^32 (two days at 48 kHz declared in 81 bytes)', () => {
    const frames = 48000 * 3600 * 48 // 8 294 400 000 > 2^32
    const header = readFlacHeader(flacBomb({ declaredFrames: frames, blocks: 1, channels: 8, sampleRate: 96000 }))
    expect(header).toEqual({ codec: 'flac', channels: 8, sampleRate: 96000, frames, minDurationS: null })
  })

  it('treats a total of 0 as unknown and refuses what is not STREAMINFO', () => {
    expect(readFlacHeader(flacBomb({ declaredFrames: 0, blocks: 1 }))?.frames).toBeNull()
    expect(readFlacHeader(new TextEncoder().encode('fLaC'))).toBeNull()
    expect(readFlacHeader(fixture('strike-48k-16bit.wav'))).toBeNull()
  })
})
