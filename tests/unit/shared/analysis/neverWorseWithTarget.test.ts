import { readFileSync } from 'node:fs'
import { beforeAll, describe, expect, it } from 'vitest'
import { analyzeSamples, analyzeStrike, type MeasuredPartial } from '../../../../shared/analysis/index'
import { scorePartials } from '../../../support/accuracy'
import { FOUND_WITHIN_CENTS } from '../../../support/fixtureAccuracy'
import { REALISTIC_CASES, renderRealisticCase, tunedTruth } from '../../../support/realisticStrikes'
import { realFixturePath, realFixtures } from '../../../support/realFixtures'

// "Never worse with a target than without one", on every recording (freepats notes through
// timidity, sonic-pi-samples strokes: tests/fixtures/real/README.md) and every realistic
// synthesis (tests/support/realisticStrikes.ts), for the family's template and for the two
// templates that starved 1.0.0's window: the fundamental alone, and a wide one (×1, ×4, ×10,
// the vibraphone's tuning; source: Rossing, Science of Percussion Instruments, 2000, ch. 3).
interface Case {
  id: string
  referenceHz: number[]
  toleranceCents: number
  without: MeasuredPartial[]
  withTemplate: { name: string, partials: MeasuredPartial[] }[]
}

const templates = (family: number[]) => [
  { name: 'family template', ratios: family },
  { name: 'fundamental only', ratios: [1] },
  { name: 'wide ×1 ×4 ×10', ratios: [1, 4, 10] },
]

const cases: Case[] = []
beforeAll(async () => {
  for (const fixture of realFixtures()) {
    const bytes = new Uint8Array(readFileSync(realFixturePath(fixture)))
    const withTemplate = []
    for (const t of templates(fixture.ratios)) {
      withTemplate.push({ name: t.name, partials: (await analyzeStrike(bytes, { targetHz: fixture.targetHz, ratios: t.ratios })).partials })
    }
    cases.push({
      id: fixture.id,
      referenceHz: fixture.reference.map(r => r.frequencyHz),
      toleranceCents: FOUND_WITHIN_CENTS.recording,
      without: (await analyzeStrike(bytes, {})).partials,
      withTemplate,
    })
  }
  for (const c of REALISTIC_CASES) {
    const x = renderRealisticCase(c)
    const rate = c.options.sampleRate
    cases.push({
      id: `synthesis ${c.id}`,
      referenceHz: tunedTruth(c.partials).map(p => p.frequencyHz),
      toleranceCents: FOUND_WITHIN_CENTS.synthesis,
      without: analyzeSamples(x, rate).partials,
      withTemplate: templates(c.ratios).map(t => ({ name: t.name, partials: analyzeSamples(x, rate, { targetHz: c.targetHz, ratios: t.ratios }).partials })),
    })
  }
}, 600_000)

describe('never worse with a target than without one', () => {
  it('covers every recording and every realistic synthesis', () => {
    expect(cases).toHaveLength(realFixtures().length + REALISTIC_CASES.length)
  })

  it('finds with each template every reference partial it finds without a target', () => {
    for (const c of cases) {
      const without = scorePartials(c.without, c.referenceHz, c.toleranceCents).found
      for (const t of c.withTemplate) {
        const withT = scorePartials(t.partials, c.referenceHz, c.toleranceCents).found
        without.forEach((found, i) => {
          if (found) expect(withT[i], `${c.id} ${c.referenceHz[i]} Hz with the ${t.name}`).toBe(true)
        })
      }
    }
  })

  it('finds every partial of the realistic syntheses whatever the template', () => {
    for (const c of cases.filter(k => k.id.startsWith('synthesis'))) {
      expect(scorePartials(c.without, c.referenceHz, c.toleranceCents).found.every(Boolean), `${c.id} without target`).toBe(true)
      for (const t of c.withTemplate) {
        expect(scorePartials(t.partials, c.referenceHz, c.toleranceCents).found.every(Boolean), `${c.id} with the ${t.name}`).toBe(true)
      }
    }
  })
})
