import { describe, expect, it } from 'vitest'
import { phasorTable } from '../../../../shared/analysis/phasorTable'

describe('phasorTable', () => {
  it('gives cos kθ and sin kθ, starting at k = 0 with 1 and 0', () => {
    const { cos, sin } = phasorTable(Math.PI / 6, 13)
    // source: unit-circle values, cos 30° = √3/2, sin 30° = 1/2, cos 90° = 0, cos 180° = −1
    expect(cos[0]).toBe(1)
    expect(sin[0]).toBe(0)
    expect(cos[1]).toBeCloseTo(Math.sqrt(3) / 2, 15)
    expect(sin[1]).toBeCloseTo(0.5, 15)
    expect(cos[3]).toBeCloseTo(0, 14)
    expect(sin[3]).toBeCloseTo(1, 14)
    expect(cos[6]).toBeCloseTo(-1, 14)
    expect(cos[12]).toBeCloseTo(1, 14)
    expect(sin[12]).toBeCloseTo(0, 14)
  })

  it('stays on the unit circle and within 1e-11 of Math.cos / Math.sin over 20 000 steps', () => {
    const step = (2 * Math.PI * 523.25) / 48000
    const { cos, sin } = phasorTable(step, 20000)
    let worst = 0
    for (let k = 0; k < 20000; k++) {
      // source: Pythagorean identity cos² + sin² = 1 and the library's own cos/sin
      worst = Math.max(worst, Math.abs(cos[k]! - Math.cos(k * step)), Math.abs(sin[k]! - Math.sin(k * step)), Math.abs(Math.hypot(cos[k]!, sin[k]!) - 1))
    }
    expect(worst).toBeLessThan(1e-11)
  })

  it('fills the table it is given', () => {
    const out = { cos: new Float64Array(4), sin: new Float64Array(4) }
    const table = phasorTable(Math.PI / 2, 3, out)
    // source: unit-circle values at 0°, 90°, 180°
    expect(table.cos).toBe(out.cos)
    expect(out.cos[0]).toBe(1)
    expect(out.sin[1]).toBeCloseTo(1, 15)
    expect(out.cos[2]).toBeCloseTo(-1, 15)
    expect(out.cos[3]).toBe(0)
  })

  it('gives an empty table for count 0 and refuses a bad step or count', () => {
    expect(phasorTable(0.1, 0).cos.length).toBe(0)
    expect(() => phasorTable(Number.NaN, 4)).toThrow(RangeError)
    expect(() => phasorTable(0.1, 2.5)).toThrow(RangeError)
    expect(() => phasorTable(0.1, -1)).toThrow(RangeError)
  })
})
