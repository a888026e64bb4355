import { describe, expect, it } from 'vitest'
import {
  AnalysisError,
  analyzeSamples,
  analyzeStrike,
  decodeAudio,
  detectContainer,
  encodeWav,
  mixToMono,
  readWavHeader,
} from '../../../../shared/analysis/index'
import { synthStrike } from '../../../support/synthStrike'
import { writeWav } from '../../../support/writeWav'
import { audioFixture } from '../../../support/audioFixture'

const fixture = audioFixture

/** Expect an AnalysisError with this status and code; its message is one sentence. */
async function expectRefusal(run: () => Promise<unknown> | unknown, status: number, code: string) {
  let caught: unknown
  try {
    await run()
  }
  catch (error) {
    caught = error
  }
  expect(caught, `expected ${status} ${code}`).toBeInstanceOf(AnalysisError)
  const error = caught as AnalysisError
  expect({ status: error.status, code: error.code }).toEqual({ status, code })
  expect(error.message).toMatch(/^[A-Z].*[.]$/)
  expect(error.message).not.toMatch(/\n/)
  return error
}

const strike = (sampleRate: number, durationS = 0.6) =>
  synthStrike(
    [
      { frequencyHz: 440, amplitudeDb: -8, decayDbPerS: 10, phaseRad: 0 },
      { frequencyHz: 1212.86, amplitudeDb: -14, decayDbPerS: 20, phaseRad: 1 },
    ],
    { sampleRate, durationS, onsetS: 0.05 },
  )

describe('decoding every accepted format', () => {
  // Fixtures made by scripts/make-test-audio.sh: sox sines at 440 Hz and 1212.86 Hz.
  const cases: [string, number, number][] = [
    ['strike-48k-16bit.wav', 48000, 0.05],
    ['strike-44k1-24bit.wav', 44100, 0.05],
    ['strike-44k1-float.wav', 44100, 0.05],
    ['strike-48k.flac', 48000, 0.05],
    ['strike-96k.flac', 96000, 0.05],
    ['strike-44k1.mp3', 44100, 0.1], // MP3 adds encoder delay and padding
    ['strike-48k.ogg', 48000, 0.05],
    ['strike-48k-16bit.aiff', 48000, 0.05],
    ['strike-44k1-24bit.aifc', 44100, 0.05],
  ]
  for (const [name, rate, maxCents] of cases) {
    it(`reads ${name} and finds both sines`, async () => {
      const result = await analyzeStrike(fixture(name), { targetHz: 440, ratios: [1, 2.7565], tolerances: [1] })
      expect(result.sampleRate).toBe(rate)
      expect(result.channels).toBe(1)
      expect(result.partials).toHaveLength(2)
      expect(result.verdict).toBe('within')
      for (const m of result.matches!) expect(Math.abs(m.cents!)).toBeLessThan(maxCents)
    })
  }

  it('recognises containers by their magic bytes', () => {
    expect(detectContainer(fixture('strike-48k-16bit.wav'))).toBe('wav')
    expect(detectContainer(fixture('strike-48k.flac'))).toBe('flac')
    expect(detectContainer(fixture('strike-44k1.mp3'))).toBe('mp3')
    expect(detectContainer(fixture('strike-48k.ogg'))).toBe('ogg')
    expect(detectContainer(fixture('strike-48k-16bit.aiff'))).toBe('aiff')
    expect(detectContainer(fixture('strike-44k1-24bit.aifc'))).toBe('aiff')
    expect(detectContainer(fixture('not-audio.txt'))).toBe('other')
  })

  for (const format of ['pcm16', 'pcm24', 'float32'] as const) {
    it(`round-trips ${format} WAV samples within the format's resolution`, async () => {
      const x = strike(48000)
      const decoded = await decodeAudio(writeWav([x], 48000, format))
      expect(decoded.sampleRate).toBe(48000)
      const y = decoded.channelData[0]!
      expect(y.length).toBe(x.length)
      // Half a code of rounding, plus for 16-bit the decoder's scaling of positive codes by
      // 1/32767 rather than 1/32768 (another half code at most): one and a half codes.
      const step = 1.5 * (format === 'pcm16' ? 2 ** -15 : format === 'pcm24' ? 2 ** -23 : 2 ** -24)
      let maxError = 0
      for (let i = 0; i < x.length; i++) maxError = Math.max(maxError, Math.abs(y[i]! - x[i]!))
      expect(maxError).toBeLessThanOrEqual(step)
    })
  }

  it('encodeWav writes 16-bit PCM that decodes back and measures the same', async () => {
    const x = strike(44100)
    const bytes = encodeWav(x, 44100)
    const header = readWavHeader(bytes)
    expect(header).toMatchObject({ formatTag: 1, channels: 1, sampleRate: 44100, bitsPerSample: 16, frames: x.length })
    const fromFile = await analyzeStrike(bytes)
    const fromSamples = analyzeSamples(x, 44100)
    expect(fromFile.partials.map(p => p.frequencyHz)).toEqual(fromSamples.partials.map(p => p.frequencyHz))
  })

  it('mixes channels to mono by averaging and reports the channel count', async () => {
    const x = strike(48000)
    const quieter = x.map(v => v / 2)
    const result = await analyzeStrike(writeWav([x, quieter], 48000, 'pcm24'))
    expect(result.channels).toBe(2)
    // The mix of 1 and ½ is ¾ of the louder channel: 20·log10(0.75) = −2.50 dB.
    expect(result.partials[0]!.amplitudeDb).toBeCloseTo(-8 - 2.5, 1)
    expect(Array.from(mixToMono([[1, 3], [3, 5]]))).toEqual([2, 4])
  })

  it('leaves a silent channel out of the mix and says so', async () => {
    const x = strike(48000)
    const result = await analyzeStrike(writeWav([new Float64Array(x.length), x], 48000, 'pcm24'))
    expect(result.channels).toBe(2)
    // The live channel's own level, not halved by the dead one.
    expect(result.partials[0]!.amplitudeDb).toBeCloseTo(-8, 1)
    expect(result.warnings).toContain('channel 1 is silent or nearly so (40 dB or more under the loudest); it was left out of the mix')
  })

  it('inverts a channel in opposite polarity instead of cancelling the strike', async () => {
    const x = strike(48000)
    const result = await analyzeStrike(writeWav([x, x.map(v => -v)], 48000, 'pcm24'))
    expect(result.partials.map(p => Math.round(p.frequencyHz))).toEqual([440, 1213])
    expect(result.partials[0]!.amplitudeDb).toBeCloseTo(-8, 1)
    expect(result.warnings).toContain('channel 2 is in opposite polarity to the loudest channel; it was inverted before mixing')
  })

  it('keeps the native sample rate at 8 kHz and 192 kHz', async () => {
    for (const rate of [8000, 192000]) {
      const result = await analyzeStrike(writeWav([strike(rate, 0.5)], rate, 'float32'))
      expect(result.sampleRate).toBe(rate)
      expect(result.partials.map(p => Math.round(p.frequencyHz))).toEqual([440, 1213])
    }
  })
})

describe('bad input gets a clear refusal', () => {
  it('413: a file over 50 MB', async () => {
    await expectRefusal(() => analyzeStrike(new Uint8Array(50 * 1024 * 1024 + 1)), 413, 'too_large')
  })

  it('415: an empty file', async () => {
    await expectRefusal(() => analyzeStrike(fixture('empty.wav')), 415, 'empty_file')
    await expectRefusal(() => analyzeStrike(new Uint8Array(0)), 415, 'empty_file')
  })

  it('415: a file that is not audio', async () => {
    await expectRefusal(() => analyzeStrike(fixture('not-audio.txt')), 415, 'not_audio')
    const noise = new Uint8Array(4096).map((_, i) => (i * 97 + 13) % 251)
    await expectRefusal(() => analyzeStrike(noise), 415, 'not_audio')
  })

  it('415: a truncated or damaged header', async () => {
    await expectRefusal(() => analyzeStrike(fixture('truncated-header.wav')), 415, 'corrupt_audio')
    const bytes = encodeWav(strike(48000), 48000)
    await expectRefusal(() => analyzeStrike(bytes.slice(0, 20)), 415, 'corrupt_audio')
    const flac = fixture('strike-48k.flac')
    const damaged = flac.slice()
    damaged.fill(0xff, 4, 200) // keep the "fLaC" marker, wreck the stream header
    await expectRefusal(() => analyzeStrike(damaged), 415, 'corrupt_audio')
    await expectRefusal(() => analyzeStrike(fixture('truncated-header.aiff')), 415, 'corrupt_audio')
  })

  it('415: a compressed AIFF-C encoding it does not read', async () => {
    const bytes = fixture('strike-44k1-24bit.aifc').slice()
    // COMM's compression type (after FORM, FVER and COMM's own 26 bytes): 'NONE' → 'ima4'.
    const at = bytes.findIndex((_, i) => String.fromCharCode(...bytes.subarray(i, i + 4)) === 'NONE')
    bytes.set(new TextEncoder().encode('ima4'), at)
    await expectRefusal(() => analyzeStrike(bytes), 415, 'unsupported_audio')
  })

  it('415: a compressed WAV encoding it does not read', async () => {
    const bytes = encodeWav(strike(48000), 48000)
    new DataView(bytes.buffer).setUint16(20, 2, true) // format tag 2: ADPCM
    await expectRefusal(() => analyzeStrike(bytes), 415, 'unsupported_audio')
    // IMA ADPCM as a recorder writes it (format tag 0x11, 4 bits a sample in 256-byte blocks): its
    // 0.6 s of data read as one frame a block would be 0.005 s; the encoding, not the length, is what is wrong.
    const adpcm = encodeWav(strike(48000), 48000)
    const view = new DataView(adpcm.buffer)
    view.setUint16(20, 0x11, true)
    view.setUint16(32, 256, true)
    view.setUint16(34, 4, true)
    await expectRefusal(() => analyzeStrike(adpcm), 415, 'unsupported_audio')
  })

  it('415: sample values that are not numbers', async () => {
    const x = new Float32Array(strike(48000))
    x[1000] = Number.NaN
    await expectRefusal(() => analyzeSamples(x, 48000), 415, 'corrupt_audio')
  })

  it('422: zero frames', async () => {
    await expectRefusal(() => analyzeStrike(encodeWav([], 48000)), 422, 'no_frames')
    await expectRefusal(() => analyzeSamples(new Float64Array(0), 48000), 422, 'no_frames')
  })

  it('422: under 0.2 s', async () => {
    await expectRefusal(() => analyzeStrike(encodeWav(strike(48000, 0.19), 48000)), 422, 'too_short')
    await expectRefusal(() => analyzeStrike(fixture('truncated.flac')), 422, 'too_short')
    expect(analyzeSamples(strike(48000, 0.2), 48000).partials.length).toBeGreaterThan(0)
  })

  it('422: digital silence', async () => {
    await expectRefusal(() => analyzeStrike(encodeWav(new Float64Array(48000), 48000)), 422, 'silent')
    await expectRefusal(() => analyzeSamples(new Float32Array(48000), 48000), 422, 'silent')
  })

  it('422: a sample rate outside 8–192 kHz', async () => {
    await expectRefusal(() => analyzeStrike(writeWav([new Float64Array(4000).fill(0.1)], 4000)), 422, 'bad_sample_rate')
    await expectRefusal(() => analyzeStrike(writeWav([new Float64Array(96000).fill(0.1)], 250000)), 422, 'bad_sample_rate')
    await expectRefusal(() => analyzeSamples(strike(48000), 7999), 422, 'bad_sample_rate')
  })

  it('422: more than 8 channels', async () => {
    const x = strike(8000, 0.3)
    await expectRefusal(() => analyzeStrike(writeWav(Array.from({ length: 9 }, () => x), 8000)), 422, 'too_many_channels')
    const eight = await analyzeStrike(writeWav(Array.from({ length: 8 }, () => x), 8000))
    expect(eight.channels).toBe(8)
  })

  it('422: over 60 s', async () => {
    const long = new Float64Array(8000 * 61)
    long[100] = 0.5
    await expectRefusal(() => analyzeStrike(encodeWav(long, 8000)), 422, 'too_long')
    await expectRefusal(() => analyzeSamples(long, 8000), 422, 'too_long')
  })

  it('400: bad options, before any decoding', async () => {
    const error = await expectRefusal(() => analyzeStrike(new Uint8Array(0), { referenceHz: 300 }), 400, 'bad_option')
    expect(error.message).toBe('The reference pitch must be between 400 and 480 Hz.')
  })
})

describe('warnings, not errors', () => {
  it('an AIFF cut short is measured with a warning that says how much is missing', async () => {
    const result = await analyzeStrike(fixture('truncated.aiff'))
    // COMM declares 40 800 frames (0.85 s); 14 956 are present (0.31 s).
    expect(result.warnings[0]).toBe('truncated AIFF file: the header declares 0.85 s of audio but the file holds 0.31 s; only that part was measured')
    expect(result.partials.map(p => Math.round(p.frequencyHz))).toContain(440)
  })

  it('clipping is counted', () => {
    const x = strike(48000).map(v => Math.max(-0.2, Math.min(0.2, v * 3)) * 5)
    const result = analyzeSamples(x, 48000)
    const warning = result.warnings.find(w => w.startsWith('clipped samples: '))
    expect(warning).toBeDefined()
    let clipped = 0
    for (const v of x) if (Math.abs(v) >= 1 - 2 ** -14) clipped++
    expect(warning).toMatch(new RegExp(`^clipped samples: ${clipped} \\(.*turn the input gain down`))
  })

  it('a large DC offset is reported and removed', () => {
    const x = strike(48000).map(v => v + 0.1)
    const result = analyzeSamples(x, 48000)
    expect(result.warnings.some(w => w.startsWith('DC offset: 0.1'))).toBe(true)
    expect(result.partials.map(p => Math.round(p.frequencyHz))).toEqual([440, 1213])
  })
})

describe('AIFF', () => {
  it('decodes sample for sample what the same strike holds as WAV (both written by sox)', async () => {
    const wav = await decodeAudio(fixture('strike-48k-16bit.wav'))
    const aiff = await decodeAudio(fixture('strike-48k-16bit.aiff'))
    expect(aiff.sampleRate).toBe(wav.sampleRate)
    expect(aiff.pcmBits).toBe(16)
    // As integer codes: the WAV decoder scales positive codes by 1/32767, the AIFF decoder by 1/32768.
    const wavCodes = Array.from(wav.channelData[0]!, v => Math.round(v * (v > 0 ? 32767 : 32768)))
    const aiffCodes = Array.from(aiff.channelData[0]!, v => Math.round(v * 32768))
    expect(aiffCodes).toEqual(wavCodes)
    expect(Math.max(...aiffCodes)).toBeGreaterThan(10000)
  })
})
