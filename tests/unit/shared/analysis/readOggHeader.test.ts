import { describe, expect, it } from 'vitest'
import { readOggHeader } from '../../../../shared/analysis/readOggHeader'
import { oggPage, opusBomb } from '../../../support/audioBombs'
import { audioFixture } from '../../../support/audioFixture'

const fixture = audioFixture

describe('readOggHeader', () => {
  it('reads a Vorbis file written by another encoder: rate, channels, length from the last granule', () => {
    // scripts/make-test-audio.sh: 48 kHz mono Vorbis, 1.0 s + 0.05 s = 50 400 samples.
    expect(readOggHeader(fixture('strike-48k.ogg'))).toEqual({ codec: 'vorbis', channels: 1, sampleRate: 48000, frames: 50400, minDurationS: null })
  })

  it('reads Opus at 48 kHz with the pre-skip taken off the last granule', () => {
    // RFC 7845 §4: playable samples = last granule − pre-skip (312 in the helper).
    const header = readOggHeader(opusBomb({ declaredFrames: 48000 * 7200, pages: 1, channels: 2 }))
    expect(header).toEqual({ codec: 'opus', channels: 2, sampleRate: 48000, frames: 48000 * 7200 - 312, minDurationS: null })
  })

  it('gives no length when no page states a granule, and nothing for another codec', () => {
    const head = new Uint8Array(19)
    head.set([...'OpusHead'].map(c => c.charCodeAt(0)))
    head[9] = 1
    // Granule −1: no packet ends on the page (RFC 3533 §6).
    const onlyHead = oggPage([head], -1, 0, 0x02)
    expect(readOggHeader(onlyHead)).toMatchObject({ codec: 'opus', frames: null })
    expect(readOggHeader(oggPage([new TextEncoder().encode('\x80theora-not-audio-at-all')], 0, 0))).toBeNull()
    expect(readOggHeader(new TextEncoder().encode('OggS'))).toBeNull()
  })
})
