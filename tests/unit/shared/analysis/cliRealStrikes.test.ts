import { mkdirSync, readFileSync, writeFileSync } from 'node:fs'
import { join } from 'node:path'
import { describe, expect, it } from 'vitest'
import { analyzeStrike, encodeWav } from '../../../../shared/analysis/index'
import { scorePartials } from '../../../support/accuracy'
import { runAnalyzeCli } from '../../../support/analyzeCli'
import { REAL_FIXTURE_DIR, realFixturePath, realFixtures } from '../../../support/realFixtures'
import { REALISTIC_CASES, renderRealisticCase, tunedTruth } from '../../../support/realisticStrikes'

// The Bench's path, `npm run analyze -- FILE --target-hz F --ratios R --json`, on real strikes.

function cliJson(file: string, targetHz: number, ratios: number[]) {
  const run = runAnalyzeCli([file, '--target-hz', String(targetHz), '--ratios', ratios.join(','), '--json'])
  expect(run.stderr).toBe('')
  expect(run.status).toBe(0)
  return JSON.parse(run.stdout)
}

describe('npm run analyze on real strikes', () => {
  for (const id of ['xylophone-f4', 'tubular-bells-c5', 'timpani-f2']) {
    it(`${id}: prints the same JSON as analyzeStrike and finds the manual reading's partials`, async () => {
      const fixture = realFixtures().find(f => f.id === id)!
      const file = realFixturePath(fixture)
      const printed = cliJson(file, fixture.targetHz, fixture.ratios)
      const direct = await analyzeStrike(new Uint8Array(readFileSync(file)), { targetHz: fixture.targetHz, ratios: fixture.ratios })
      expect(printed).toEqual(JSON.parse(JSON.stringify(direct)))
      expect(printed.engineVersion).toBe('2.0.0')
      const score = scorePartials(printed.partials, fixture.reference.map(r => r.frequencyHz))
      // At least the two lowest reference partials (fundamental and first tuned overtone).
      expect(score.found.slice(0, 2), id).toEqual([true, true])
      for (const p of printed.partials) {
        for (const key of ['modulationHz', 'modulationDepthDb', 'crossCheckCents', 'uncertaintyCents', 'uncertaintyDecayPct']) expect(p).toHaveProperty(key)
      }
    }, 120_000)
  }

  it('a vibraphone bar at 131 Hz with tremolo keeps its fundamental with a 1, 4, 10 template', () => {
    const c = REALISTIC_CASES.find(k => k.id === 'vibraphone-c3-tremolo')!
    const dir = join(REAL_FIXTURE_DIR, '..', 'synthetic')
    mkdirSync(dir, { recursive: true })
    const file = join(dir, `${c.id}.wav`)
    writeFileSync(file, encodeWav(renderRealisticCase(c), c.options.sampleRate))
    const printed = cliJson(file, c.targetHz, c.ratios)
    const fundamental = printed.matches.find((m: { ratio: number }) => m.ratio === 1)
    expect(fundamental.missing).toBe(false)
    expect(Math.abs(fundamental.rawCents - 1200 * Math.log2(130.87 / 130.81))).toBeLessThan(0.1)
    for (const p of printed.partials) expect(p.amplitudeDb).toBeLessThan(0)
    expect(scorePartials(printed.partials, tunedTruth(c.partials).map(p => p.frequencyHz), 1).found).toEqual([true, true, true])
  }, 120_000)
})
