import { describe, expect, it } from 'vitest'
import { templateSearchWindows } from '../../../../shared/analysis/templateSearchWindows'

describe('templateSearchWindows', () => {
  it('keeps the template window where the targets lie far apart', () => {
    expect(templateSearchWindows([100, 400, 1000], 100)).toEqual([100, 100, 100])
  })

  it('narrows to half the distance to the nearest other target', () => {
    // source: the cent, 1200 · log2(f2 / f1) (Ellis 1885); 1.2 / 1 is 315.64 ¢, 1.5 / 1.2 is 386.31 ¢.
    const windows = templateSearchWindows([500, 600, 750], 200)
    expect(windows[0]).toBeCloseTo(315.641 / 2, 2)
    expect(windows[1]).toBeCloseTo(315.641 / 2, 2)
    expect(windows[2]).toBeCloseTo(386.314 / 2, 2)
  })

  it('refuses a window that is not positive', () => {
    expect(() => templateSearchWindows([100], 0)).toThrow(RangeError)
  })
})
