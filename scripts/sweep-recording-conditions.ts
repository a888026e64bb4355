// The recording-conditions table (not a test): each case of tests/support/recordingConditions.ts
// run without a target and with its family's target and template, printing found/expected,
// the largest frequency error of a found tuned partial, the largest amplitude and decay error
// where the file keeps them, how many partials were reported and the warnings that name the condition.
//   npx tsx scripts/sweep-recording-conditions.ts [--only TEXT]
import { analyzeStrike, centsBetween, type AnalysisResult } from '../shared/analysis/index'
import { CONDITION_CASES, type ConditionCase } from '../tests/support/recordingConditions'

const FOUND_CENTS = 5 // as the realistic syntheses' tests: tests/support/fixtureAccuracy.ts
const args = process.argv.slice(2)
const only = args.includes('--only') ? args[args.indexOf('--only') + 1] : undefined

function summary(c: ConditionCase, r: AnalysisResult): string {
  const near = c.truthHz.map(f => r.partials.reduce((a, b) => (Math.abs(centsBetween(b.frequencyHz, f)) < Math.abs(centsBetween(a.frequencyHz, f)) ? b : a)))
  const cents = near.map((p, i) => Math.abs(centsBetween(p.frequencyHz, c.truthHz[i]!)))
  const found = cents.filter(e => e <= FOUND_CENTS)
  const dA = c.truthDb ? Math.max(...near.map((p, i) => Math.abs(p.amplitudeDb - c.truthDb![i]!))).toFixed(1) : '–'
  const dD = c.truthDecayDbPerS ? (100 * Math.max(...near.map((p, i) => Math.abs(p.decayDbPerS / c.truthDecayDbPerS![i]! - 1)))).toFixed(0) : '–'
  return `${found.length}/${c.truthHz.length}  ${Math.max(0, ...found).toFixed(3)} ¢  ${dA} dB  ${dD} %  n=${r.partials.length}`
}

console.log(`${'case'.padEnd(58)}${'no target: found, max ¢, amp, decay'.padEnd(40)}with target`)
for (const c of CONDITION_CASES.filter(k => !only || k.id.includes(only))) {
  const bytes = c.bytes()
  const without = await analyzeStrike(bytes, {})
  const withTarget = await analyzeStrike(bytes, { targetHz: c.targetHz, ratios: c.ratios })
  const said = c.warning ? (without.warnings.some(w => c.warning!.test(w)) ? '  (said)' : '  (NOT SAID)') : ''
  console.log(`${`${c.id} [${c.family}]`.slice(0, 57).padEnd(58)}${summary(c, without).padEnd(40)}${summary(c, withTarget)}${said}`)
}
