import { describe, expect, it } from 'vitest'
import { selectModelOrder } from '../../../../shared/analysis/selectModelOrder'

describe('selectModelOrder', () => {
  it('counts the eigenvalues that stand clear of an equal noise floor', () => {
    // Three signals over ten equal noise eigenvalues: MDL's worked case (Wax & Kailath 1985, §III).
    const sigma = [30, 12, 5, ...Array.from({ length: 10 }, () => 1)]
    expect(selectModelOrder(sigma, 50, { maxOrder: 8 })).toBe(3)
  })

  it('finds none in white noise alone and then keeps to minOrder', () => {
    const sigma = Array.from({ length: 12 }, () => 1)
    expect(selectModelOrder(sigma, 40, { maxOrder: 8, minOrder: 0 })).toBe(0)
    expect(selectModelOrder(sigma, 40, { maxOrder: 8 })).toBe(1)
    expect(selectModelOrder(sigma, 40, { maxOrder: 8, minOrder: 2 })).toBe(2)
  })

  it('never exceeds maxOrder', () => {
    const sigma = [10, 9, 8, 7, 6, 5, 0.01, 0.01, 0.01]
    expect(selectModelOrder(sigma, 100, { maxOrder: 6 })).toBe(6)
    expect(selectModelOrder(sigma, 100, { maxOrder: 4 })).toBe(4)
  })

  it('refuses too few values or inconsistent limits', () => {
    expect(() => selectModelOrder([1], 10, { maxOrder: 1 })).toThrow(RangeError)
    expect(() => selectModelOrder([2, 1], 10, { maxOrder: 1, minOrder: 2 })).toThrow(RangeError)
  })
})
