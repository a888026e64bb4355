import { mkdirSync, writeFileSync } from 'node:fs'
import { join } from 'node:path'
import { describe, expect, it } from 'vitest'
import { analyzeStrike } from '../../../../shared/analysis/index'
import { scorePartials } from '../../../support/accuracy'
import { runAnalyzeCli } from '../../../support/analyzeCli'
import { FOUND_WITHIN_CENTS } from '../../../support/fixtureAccuracy'
import { REAL_FIXTURE_DIR } from '../../../support/realFixtures'
import { CONDITION_CASES } from '../../../support/recordingConditions'

// The Bench's path, `npm run analyze -- FILE --target-hz F --ratios R --json`, on each family's usual
// template and on the recording conditions that once went wrong (tests/support/recordingConditions.ts).
const dir = join(REAL_FIXTURE_DIR, '..', 'conditions')

const CLI_CASES = CONDITION_CASES.filter(c => /^(marimba|xylophone|glockenspiel|chimes|timpani|vibraphone) |stereo|second strike|192 kHz|header declares|hard-clipped|FLAC/.test(c.id))

describe('npm run analyze on recordings made the workshop way', () => {
  it('runs every family and the conditions that once failed', () => {
    expect(new Set(CLI_CASES.map(c => c.family))).toEqual(new Set(['marimba', 'xylophone', 'glockenspiel', 'chimes', 'timpani', 'vibraphone']))
    expect(CLI_CASES.length).toBeGreaterThanOrEqual(14)
  })

  CLI_CASES.forEach((c, n) => {
    it(`${c.id} (${c.family}, ratios ${c.ratios.join(':')}): prints analyzeStrike's JSON, every template partial found`, async () => {
      mkdirSync(dir, { recursive: true })
      const bytes = c.bytes()
      const file = join(dir, `case-${n}.${c.id.includes('FLAC') ? 'flac' : 'wav'}`)
      writeFileSync(file, bytes)
      const run = runAnalyzeCli([file, '--target-hz', String(c.targetHz), '--ratios', c.ratios.join(','), '--json'])
      expect(run.stderr).toBe('')
      expect(run.status).toBe(0)
      const printed = JSON.parse(run.stdout)
      const direct = await analyzeStrike(bytes, { targetHz: c.targetHz, ratios: c.ratios })
      expect(printed).toEqual(JSON.parse(JSON.stringify(direct)))
      expect(scorePartials(printed.partials, c.truthHz, FOUND_WITHIN_CENTS.synthesis).found).toEqual(c.truthHz.map(() => true))
      for (const m of printed.matches) expect(m.missing, `ratio ${m.ratio}`).toBe(false)
      if (c.warning) expect(printed.warnings.some((w: string) => c.warning!.test(w))).toBe(true)
    }, 120_000)
  })
})
