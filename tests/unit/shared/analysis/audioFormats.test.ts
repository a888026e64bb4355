import { describe, expect, it } from 'vitest'
import { AUDIO_FILE_ACCEPT, AUDIO_FORMAT_NAMES, AUDIO_FORMATS, storedAudioExtension } from '../../../../shared/analysis/audioFormats'
import { containerMedia } from '../../../../shared/analysis/containerMediaType'
import { detectContainer } from '../../../../shared/analysis/detectContainer'
import { audioFixture } from '../../../support/audioFixture'

describe('the audio formats Tonewright reads', () => {
  it('names them once for people and for the file picker', () => {
    expect(AUDIO_FORMAT_NAMES).toBe('WAV, FLAC, AIFF, MP3 or Ogg')
    expect(AUDIO_FILE_ACCEPT.split(',')).toEqual(['audio/*', '.wav', '.flac', '.aif', '.aiff', '.aifc', '.mp3', '.ogg', '.oga', '.opus'])
  })

  it('stores a recording under its format\'s extension, whatever the case of its name', () => {
    expect(storedAudioExtension('C4.WAV')).toBe('wav')
    expect(storedAudioExtension('F#5 second try.aif')).toBe('aiff')
    expect(storedAudioExtension('bar.aifc')).toBe('aiff')
    expect(storedAudioExtension('take.opus')).toBe('ogg')
    expect(storedAudioExtension('notes.txt')).toBe('bin')
    expect(storedAudioExtension('C4')).toBe('bin')
  })

  it('serves each container it detects with that format\'s media type', () => {
    // Media types: IANA audio/wav, audio/flac, audio/mpeg, audio/ogg; audio/aiff as browsers send it (common practice).
    const served = ['strike-48k-16bit.wav', 'strike-48k.flac', 'strike-48k-16bit.aiff', 'strike-44k1.mp3', 'strike-48k.ogg']
      .map(name => containerMedia(detectContainer(audioFixture(name)))?.type)
    expect(served).toEqual(['audio/wav', 'audio/flac', 'audio/aiff', 'audio/mpeg', 'audio/ogg'])
    expect(containerMedia(detectContainer(audioFixture('not-audio.txt')))).toBeNull()
    expect(new Set(AUDIO_FORMATS.map(f => f.kind)).size).toBe(AUDIO_FORMATS.length)
  })
})
