import { describe, expect, it } from 'vitest'
import { parabolicPeak } from '../../../../shared/analysis/parabolicPeak'

describe('parabolicPeak', () => {
  it('finds the vertex of an exact parabola', () => {
    // source: vertex of y = −3(x − 0.3)² + 7 is (0.3, 7) (algebra)
    const y = (x: number) => -3 * (x - 0.3) ** 2 + 7
    const v = parabolicPeak(y(-1), y(0), y(1))
    expect(v.offset).toBeCloseTo(0.3, 12)
    expect(v.value).toBeCloseTo(7, 12)
  })

  it('stays within half a bin at a true maximum and is centred for symmetric neighbours', () => {
    const centred = parabolicPeak(-6, 0, -6)
    expect(centred.offset).toBeCloseTo(0, 14)
    expect(centred.value).toBeCloseTo(0, 14)
    // source: three-point parabolic interpolation, offset = ½(a − c)/(a − 2b + c) ∈ [−½, ½] when b is the maximum
    expect(parabolicPeak(0, 0, -12).offset).toBeCloseTo(-0.5, 12)
    expect(parabolicPeak(-12, 0, 0).offset).toBeCloseTo(0.5, 12)
  })

  it('falls back to the middle sample where there is no maximum', () => {
    expect(parabolicPeak(1, 1, 1)).toEqual({ offset: 0, value: 1 })
    expect(parabolicPeak(0, -5, 0)).toEqual({ offset: 0, value: -5 })
  })
})
