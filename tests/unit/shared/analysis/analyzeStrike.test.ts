import { describe, expect, it } from 'vitest'
import { analyzeSamples } from '../../../../shared/analysis/analyzeSamples'
import { analyzeStrike } from '../../../../shared/analysis/analyzeStrike'
import { encodeWav } from '../../../../shared/analysis/encodeWav'
import { audioFixture } from '../../../support/audioFixture'
import { synthStrike } from '../../../support/synthStrike'

describe('analyzeStrike', () => {
  it('decodes a file and measures what analyzeSamples measures on the same samples', async () => {
    const x = synthStrike([{ frequencyHz: 587.33, amplitudeDb: -10, decayDbPerS: 15 }], { sampleRate: 22050, durationS: 1, onsetS: 0.05, noiseDb: -80, seed: 8 })
    const wav = encodeWav(x, 22050)
    // The same samples as the 16-bit file holds (RIFF/WAVE PCM: code / 32768).
    const view = new DataView(wav.buffer)
    const decoded = Float64Array.from({ length: x.length }, (_, i) => view.getInt16(44 + 2 * i, true) / 32768)
    const fromFile = await analyzeStrike(wav, { note: 'D5' })
    expect(fromFile.partials).toEqual(analyzeSamples(decoded, 22050, { note: 'D5' }).partials)
  })

  it('checks the options before decoding', async () => {
    await expect(analyzeStrike(new TextEncoder().encode('not audio'), { referenceHz: 1000 })).rejects.toMatchObject({ status: 400 })
    await expect(analyzeStrike(audioFixture('not-audio.txt'))).rejects.toMatchObject({ status: 415 })
  })

  it('reports less dynamic range from a lossy file, whose artefacts look like weak partials', async () => {
    const result = await analyzeStrike(audioFixture('strike-44k1.mp3'))
    const wav = await analyzeStrike(audioFixture('strike-48k-16bit.wav'))
    expect(result.parameters.dynamicRangeDb).toBeLessThan(wav.parameters.dynamicRangeDb)
  })
})
