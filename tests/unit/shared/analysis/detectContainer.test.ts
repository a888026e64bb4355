import { describe, expect, it } from 'vitest'
import { detectContainer, isLossy } from '../../../../shared/analysis/detectContainer'
import { audioFixture } from '../../../support/audioFixture'

const bytes = (...parts: (string | number[])[]) =>
  Uint8Array.from(parts.flatMap(p => (typeof p === 'string' ? [...p].map(c => c.charCodeAt(0)) : p)))

describe('detectContainer', () => {
  it('recognises each container by its magic bytes', () => {
    expect(detectContainer(bytes('RIFF', [0, 0, 0, 0], 'WAVE'))).toBe('wav') // source: RIFF WAVE spec, 'RIFF' size 'WAVE'
    expect(detectContainer(bytes('fLaC', [0]))).toBe('flac') // source: FLAC format spec, stream marker "fLaC"
    expect(detectContainer(bytes('OggS', [0]))).toBe('ogg') // source: RFC 3533, capture pattern "OggS"
    expect(detectContainer(bytes('ID3', [4, 0]))).toBe('mp3') // source: ID3v2 spec, tag starts with "ID3"
    expect(detectContainer(bytes([0xff, 0xfb, 0x90]))).toBe('mp3') // source: ISO/IEC 11172-3, 11-bit frame sync
    expect(detectContainer(bytes([0xff, 0xe3]))).toBe('mp3') // source: MPEG 2.5 frame sync, 11 set bits
  })

  it('recognises the recordings made by other programs', () => {
    expect(['strike-48k-16bit.wav', 'strike-48k.flac', 'strike-48k.ogg', 'strike-44k1.mp3'].map(n => detectContainer(audioFixture(n))))
      .toEqual(['wav', 'flac', 'ogg', 'mp3'])
  })

  it('calls anything else other', () => {
    expect(detectContainer(bytes('RIFF', [0, 0, 0, 0], 'AVI '))).toBe('other') // source: RIFF spec, an AVI is RIFF too
    expect(detectContainer(bytes([0xff, 0xd8, 0xff]))).toBe('other') // source: JPEG SOI marker FF D8 (from memory)
    expect(detectContainer(audioFixture('not-audio.txt'))).toBe('other')
    expect(detectContainer(new Uint8Array(0))).toBe('other')
  })

  it('knows which containers are lossy', () => {
    // common practice: MP3 and Ogg Vorbis/Opus are lossy codecs; WAV PCM and FLAC are lossless
    expect((['wav', 'flac', 'mp3', 'ogg', 'other'] as const).map(isLossy)).toEqual([false, false, true, true, true])
  })
})
