import { describe, expect, it } from 'vitest'
import { readWavHeader } from '../../../../shared/analysis/readWavHeader'
import { audioFixture } from '../../../support/audioFixture'
import { writeWav } from '../../../support/writeWav'

/** A RIFF/WAVE file with a LIST chunk of `listBytes` (odd sizes are padded) before fmt and data. */
function withListChunk(listBytes: number): Uint8Array {
  const plain = writeWav([[0.1, 0.2, 0.3]], 8000)
  const padded = listBytes + (listBytes % 2)
  const out = new Uint8Array(plain.length + 8 + padded)
  out.set(plain.subarray(0, 12))
  out.set(new TextEncoder().encode('LIST'), 12)
  new DataView(out.buffer).setUint32(16, listBytes, true)
  out.set(plain.subarray(12), 20 + padded)
  return out
}

describe('readWavHeader', () => {
  it('reads the fields of PCM and float files written by a separate writer', () => {
    const stereo24 = writeWav([[0, 0.5, -0.5], [0.1, 0.2, 0.3]], 96000, 'pcm24')
    // source: RIFF WAVE spec, block align = channels × bytes per sample = 2 × 3
    expect(readWavHeader(stereo24)).toEqual({
      formatTag: 1, channels: 2, sampleRate: 96000, bitsPerSample: 24, blockAlign: 6, dataBytes: 18, dataBytesPresent: 18, frames: 3,
    })
    // source: RIFF WAVE spec, WAVE_FORMAT_IEEE_FLOAT = 3
    expect(readWavHeader(writeWav([[0.5]], 48000, 'float32'))).toMatchObject({ formatTag: 3, bitsPerSample: 32, blockAlign: 4, frames: 1 })
  })

  it('reads a recording made by another program', () => {
    // scripts/make-test-audio.sh: 48 kHz mono 16-bit, 0.8 s strike + 0.05 s pad = 40 800 frames (sox).
    expect(readWavHeader(audioFixture('strike-48k-16bit.wav'))).toMatchObject({ channels: 1, sampleRate: 48000, bitsPerSample: 16, frames: 40800 })
  })

  it('skips other chunks, padded to an even size', () => {
    // source: RIFF spec, a chunk of odd size is followed by one pad byte
    for (const listBytes of [4, 5]) expect(readWavHeader(withListChunk(listBytes))).toMatchObject({ channels: 1, sampleRate: 8000, frames: 3 })
  })

  it('counts only the frames present in a cut-off file', () => {
    const full = writeWav([[0.1, 0.2, 0.3, 0.4]], 8000)
    expect(readWavHeader(full.subarray(0, full.length - 3))).toMatchObject({ dataBytes: 8, dataBytesPresent: 5, frames: 2 })
  })

  it('tells bytes that are not RIFF/WAVE from a damaged header', () => {
    expect(readWavHeader(new TextEncoder().encode('not a wave file at all'))).toBeNull()
    expect(readWavHeader(new TextEncoder().encode('RIFF'))).toBe('corrupt')
    expect(readWavHeader(audioFixture('truncated-header.wav'))).toBe('corrupt')
    const full = writeWav([[0.1]], 8000)
    const dataFirst = new Uint8Array(full.length - 24)
    dataFirst.set(full.subarray(0, 12))
    dataFirst.set(full.subarray(36), 12) // the data chunk with no fmt before it
    expect(readWavHeader(dataFirst)).toBe('corrupt')
  })
})
