// Writes analyzeStrike's JSON for every real fixture (.data/fixtures/real), with the
// fixture's target and ratios and without a target, to one file, so an engine change that
// should not move any reading can be checked with cmp/diff against a dump made before it:
//   npx tsx scripts/dump-fixture-analyses.ts /tmp/before.json
import { readFileSync, writeFileSync } from 'node:fs'
import { analyzeStrike } from '../shared/analysis/index'
import { realFixturePath, realFixtures } from '../tests/support/realFixtures'

const outPath = process.argv[2]
if (!outPath) {
  console.error('usage: npx tsx scripts/dump-fixture-analyses.ts <output.json>')
  process.exit(2)
}
const results: Record<string, unknown> = {}
for (const fixture of realFixtures()) {
  const bytes = new Uint8Array(readFileSync(realFixturePath(fixture)))
  results[`${fixture.id}/target`] = await analyzeStrike(bytes, { targetHz: fixture.targetHz, ratios: fixture.ratios })
  results[`${fixture.id}/none`] = await analyzeStrike(bytes, {})
}
writeFileSync(outPath, JSON.stringify(results, null, 1))
console.log(`${Object.keys(results).length} analyses written to ${outPath}`)
