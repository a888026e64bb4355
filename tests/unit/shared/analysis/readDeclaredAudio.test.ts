import { describe, expect, it } from 'vitest'
import { readDeclaredAudio } from '../../../../shared/analysis/readDeclaredAudio'
import { readWavHeader } from '../../../../shared/analysis/readWavHeader'
import { audioFixture } from '../../../support/audioFixture'

describe('readDeclaredAudio', () => {
  it('states what each container\'s header declares, before any decoding', () => {
    const wav = audioFixture('strike-48k-16bit.wav')
    const header = readWavHeader(wav)
    // scripts/make-test-audio.sh: 48 kHz mono, 0.8 s + 0.05 s = 40 800 frames (sox).
    expect(readDeclaredAudio(wav, 'wav', header === 'corrupt' ? null : header)).toEqual({ codec: 'wav', channels: 1, sampleRate: 48000, frames: 40800, minDurationS: null })
    // scripts/make-test-audio.sh: 48 kHz mono, 1.0 s + 0.05 s = 50 400 samples (libFLAC).
    expect(readDeclaredAudio(audioFixture('strike-48k.flac'), 'flac', null)).toMatchObject({ codec: 'flac', channels: 1, sampleRate: 48000, frames: 50400 })
    expect(readDeclaredAudio(audioFixture('strike-48k.ogg'), 'ogg', null)).toMatchObject({ channels: 1, sampleRate: 48000 })
    expect(readDeclaredAudio(audioFixture('strike-44k1.mp3'), 'mp3', null)).toMatchObject({ codec: 'mp3', sampleRate: 44100 })
  })

  it('declares nothing for a container it does not decode or a WAV without a header', () => {
    expect(readDeclaredAudio(audioFixture('not-audio.txt'), 'other', null)).toBeNull()
    expect(readDeclaredAudio(audioFixture('truncated-header.wav'), 'wav', null)).toBeNull()
  })
})
