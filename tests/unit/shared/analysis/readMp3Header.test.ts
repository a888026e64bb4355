import { describe, expect, it } from 'vitest'
import { readMp3Header } from '../../../../shared/analysis/readMp3Header'
import { audioFixture } from '../../../support/audioFixture'

const fixture = audioFixture

/** One MPEG-1 layer III frame header: 128 kbit/s (index 9), 44.1 kHz, joint stereo. source: ISO/IEC 11172-3 §2.4.2.3 */
const FRAME = [0xff, 0xfb, 0x90, 0x40]

describe('readMp3Header', () => {
  it('reads rate and channels of a file written by another encoder', () => {
    const header = readMp3Header(fixture('strike-44k1.mp3'))
    expect(header).toMatchObject({ codec: 'mp3', sampleRate: 44100 })
    // The fixture is 1.05 s; either its Xing frame count or the size bound must not exceed that much.
    const statedS = header!.frames !== null ? header!.frames / 44100 : header!.minDurationS!
    expect(statedS).toBeGreaterThan(0)
    expect(statedS).toBeLessThan(1.2)
  })

  it('takes the frame count of a Xing header: 1152 samples a frame for MPEG-1 layer III', () => {
    const bytes = new Uint8Array(417)
    bytes.set(FRAME)
    // Stereo MPEG-1: 32 bytes of side information, then "Xing", flags (1 = frames), count.
    bytes.set([...'Xing'].map(c => c.charCodeAt(0)), 36)
    new DataView(bytes.buffer).setUint32(40, 1)
    new DataView(bytes.buffer).setUint32(44, 100_000)
    expect(readMp3Header(bytes)).toEqual({ codec: 'mp3', channels: 2, sampleRate: 44100, frames: 100_000 * 1152, minDurationS: null })
  })

  it('without a frame count, bounds the length by the size at 320 kbit/s (the highest MPEG-1 layer III rate)', () => {
    const bytes = new Uint8Array(4_000_000)
    bytes.set(FRAME)
    // source: ISO/IEC 11172-3 table of bit rates, 320 kbit/s at index 14.
    expect(readMp3Header(bytes)!.minDurationS).toBeCloseTo((4_000_000 * 8) / 320_000, 6)
  })

  it('skips an ID3v2 tag and refuses bytes without a frame header', () => {
    const tagged = new Uint8Array(10 + 20 + 417)
    tagged.set([0x49, 0x44, 0x33, 4, 0, 0, 0, 0, 0, 20])
    tagged.set(FRAME, 30)
    expect(readMp3Header(tagged)).toMatchObject({ sampleRate: 44100, channels: 2 })
    expect(readMp3Header(new Uint8Array([0x49, 0x44, 0x33, 4, 0, 0, 0, 0, 0, 0]))).toBeNull()
    expect(readMp3Header(new Uint8Array(100))).toBeNull()
  })
})
