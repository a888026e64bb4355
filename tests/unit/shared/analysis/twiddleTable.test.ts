import { describe, expect, it } from 'vitest'
import { twiddleTable } from '../../../../shared/analysis/twiddleTable'

describe('twiddleTable', () => {
  it('holds cos and −sin of πi/N, the same numbers whether made for N or taken from a larger table', () => {
    const large = twiddleTable(4096)
    for (const size of [2, 8, 512, 2048]) {
      const table = twiddleTable(size)
      expect(table.length).toBe(2 * size)
      for (let i = 0; i < table.length; i += 2) {
        // source: definition of the DFT's twiddle factor W = e^{−2πik/2N} at angle πi/N (fft.js's layout)
        expect(table[i]).toBe(Math.cos((Math.PI * i) / size))
        expect(table[i + 1]).toBe(-Math.sin((Math.PI * i) / size))
      }
    }
    // source: cos(π/2) = 0, −sin(π/2) = −1 (index N/2·2 of the table of N is the angle π/2)
    expect(large[2 * 1024]).toBeCloseTo(0, 15)
    expect(large[2 * 1024 + 1]).toBe(-1)
  })

  it('grows its shared table for a larger size and refuses sizes that are not powers of two', () => {
    expect(twiddleTable(8192).length).toBe(16384)
    expect(twiddleTable(1024)[2]).toBe(Math.cos(Math.PI / 512))
    expect(() => twiddleTable(3)).toThrow(RangeError)
    expect(() => twiddleTable(1)).toThrow(RangeError)
  })
})
