import { describe, expect, it } from 'vitest'
import { AnalysisError } from '../../../../shared/analysis/AnalysisError'
import { encodeWav } from '../../../../shared/analysis/encodeWav'
import { calibrateRecording } from '../../../../shared/calibration/calibrateRecording'
import { synthStrike } from '../../../../shared/synthesis/synthStrike'
import { writeWav } from '../../../support/writeWav'

describe('calibrateRecording', () => {
  it('reads the offset from a WAV file of the tone', async () => {
    // A 440 Hz reference on an input reading 120 ppm high, 44.1 kHz, SNR ≈ 31 dB (−6 dBFS peak, −40 dBFS noise).
    const wav = encodeWav(synthStrike([{ frequencyHz: 440 * (1 + 120e-6), amplitudeDb: -6, decayDbPerS: 0 }], { sampleRate: 44100, durationS: 5, noiseDb: -40, seed: 4 }), 44100)
    const offset = await calibrateRecording(wav, 440, { referenceUncertaintyPpm: 0.2 })
    expect(Math.abs(offset.offsetPpm - 120)).toBeLessThan(2)
    expect(offset.uncertaintyPpm).toBeGreaterThanOrEqual(0.2)
  })

  it('reads a stereo tone whose second channel is wired with the opposite polarity', async () => {
    // The plain average of the two channels would cancel the tone to the noise left between them.
    const left = synthStrike([{ frequencyHz: 1000 * (1 - 80e-6), amplitudeDb: -6, decayDbPerS: 0 }], { sampleRate: 48000, durationS: 5, noiseDb: -40, seed: 5 })
    const right = Float64Array.from(left, v => -v)
    const offset = await calibrateRecording(writeWav([left, right], 48000, 'float32'), 1000)
    expect(Math.abs(offset.offsetPpm + 80)).toBeLessThan(2)
  })

  it('refuses bytes that are not audio with the engine\'s 415', async () => {
    await expect(calibrateRecording(new TextEncoder().encode('no sound here'), 440)).rejects.toThrow(AnalysisError)
    await expect(calibrateRecording(new TextEncoder().encode('no sound here'), 440)).rejects.toMatchObject({ status: 415 })
  })
})
