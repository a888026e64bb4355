import { describe, expect, it } from 'vitest'
import { basebandDtft } from '../../../../shared/analysis/basebandDtft'
import { directDft } from '../../../../shared/analysis/directDft'
import { inputBand } from '../../../../shared/analysis/inputBand'
import { seededRandom } from '../../../support/seededRandom'

describe('inputBand', () => {
  it('is the input itself: its DTFT at bin frequencies equals the direct DFT', () => {
    // source: definition of the DFT, X[k] = Σ x[n] e^{−2πikn/N}, summed directly by directDft
    const random = seededRandom(5)
    const x = new Float64Array(128).map(() => random.normal())
    const band = inputBand(x, 1000)
    expect(band.re).toBe(x)
    expect([band.factor, band.firstIndex, band.centerHz, band.real]).toEqual([1, 0, 0, true])
    const dft = directDft(x)
    const [v] = basebandDtft(band, [(9 * 1000) / 128])
    expect(v!.re).toBeCloseTo(dft[18]!, 9)
    expect(v!.im).toBeCloseTo(dft[19]!, 9)
  })

  it('refuses a sample rate that is not positive', () => {
    expect(() => inputBand(new Float64Array(4), 0)).toThrow(RangeError)
  })
})
