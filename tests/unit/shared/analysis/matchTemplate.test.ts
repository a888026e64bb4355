import { describe, expect, it } from 'vitest'
import { matchTemplate } from '../../../../shared/analysis/matchTemplate'
import { resolveTemplate } from '../../../../shared/analysis/resolveTemplate'
import type { PartialMatch } from '../../../../shared/analysis/types'
import { measuredPartial } from '../../../support/partials'

const partial = (frequencyHz: number, amplitudeDb = -10) => measuredPartial({ frequencyHz, amplitudeDb })
const cents = (value: number) => 2 ** (value / 1200)

describe('matchTemplate', () => {
  const template = resolveTemplate({ ratios: [1, 4, 10], tolerances: [2, 5, 8] })

  it('reports cents = 1200 log2(measured / target) and within/outside per partial', () => {
    // source: definition of the cent; tolerances 2, 5, 8 ¢ as given
    const f0 = 261.63 // source: ISO 16:1975 with 12-TET, C4 = 261.63 Hz
    const measured = [partial(f0 * cents(1.5)), partial(4 * f0 * cents(-6)), partial(10 * f0 * cents(7.9))]
    const matches = matchTemplate(measured, template, f0)
    expect(matches.map(m => m.label)).toEqual(['fundamental', 'partial ×4', 'partial ×10'])
    expect(matches.map(m => m.cents)).toEqual([expect.closeTo(1.5, 9), expect.closeTo(-6, 9), expect.closeTo(7.9, 9)])
    expect(matches.map(m => m.within)).toEqual([true, false, true])
    expect(matches.map(m => m.direction)).toEqual(['sharp', 'flat', 'sharp'])
    expect(matches.every(m => !m.missing)).toBe(true)
    expect(matches[1]!.targetHz).toBeCloseTo(4 * f0, 9)
  })

  it('takes the strongest partial within the search window and marks missing ones', () => {
    const f0 = 200
    const measured = [partial(200 * cents(30), -30), partial(200 * cents(-20), -10), partial(800 * cents(150), -5)]
    const matches = matchTemplate(measured, template, f0)
    expect(matches[0]!.measuredHz).toBeCloseTo(200 * cents(-20), 9)
    expect(matches[1]).toMatchObject({ missing: true, within: false, measuredHz: null, cents: null })
    expect(matches[2]!.missing).toBe(true)
  })

  it('never lets two template partials claim the same measured partial', () => {
    // source: ideal circular membrane modes (1,1)…: ratios 2.1355 and 2.2954 (from memory), 125 ¢ apart: windows shrink to 62.5 ¢ each.
    const t = resolveTemplate({ ratios: [2.1355, 2.2954], tolerances: [5], searchWindowCents: 200 })
    const between = matchTemplate([partial(100 * 2.1355 * cents(60))], t, 100)
    expect(between.map(m => m.missing)).toEqual([false, true])
    const nearer = matchTemplate([partial(100 * 2.1355 * cents(70))], t, 100)
    expect(nearer.map(m => m.missing)).toEqual([true, false])
  })

  it('normalises cents to the reference temperature', () => {
    const t = resolveTemplate({ ratios: [1], tolerances: [2], referenceTemperatureC: 20, temperatureCoefficientCentsPerC: -0.5 })
    // Warm bar at 24 °C reads 2.5 ¢ flat; at 20 °C it would read 2.5 − (−0.5 × 4) = … −0.5 ¢.
    const [m] = matchTemplate([partial(440 * cents(-2.5))], t, 440, 24) as [PartialMatch]
    expect(m.rawCents).toBeCloseTo(-2.5, 9)
    expect(m.normalizedCents).toBeCloseTo(-0.5, 9)
    expect(m.cents).toBeCloseTo(-0.5, 9)
    expect(m.within).toBe(true)
    const [raw] = matchTemplate([partial(440 * cents(-2.5))], t, 440) as [PartialMatch]
    expect(raw.normalizedCents).toBeNull()
    expect(raw.within).toBe(false)
  })
})
